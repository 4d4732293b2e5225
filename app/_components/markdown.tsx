import ReactMarkdown from "react-markdown";
import rehypeKatex from "rehype-katex";
import remarkMath from "remark-math";

const SAFE_PROTOCOL = /^(https?:|mailto:|#|\/)/i;

/**
 * Markdown with math ($…$ inline, $$ on their own lines for display). Raw HTML is never rendered (react-markdown
 * skips it), and links other than http(s), mailto and in-app ones lose their target.
 */
export function Markdown({ text }: { text: string }) {
  return (
    <div className="markdown space-y-2 leading-relaxed [&_a]:text-copper-deep [&_a]:underline [&_code]:num [&_code]:rounded [&_code]:bg-paper-deep [&_code]:px-1 [&_ol]:list-decimal [&_ol]:pl-6 [&_ul]:list-disc [&_ul]:pl-6">
      <ReactMarkdown remarkPlugins={[remarkMath]} rehypePlugins={[rehypeKatex]} urlTransform={(url) => (SAFE_PROTOCOL.test(url) ? url : "")}>
        {text}
      </ReactMarkdown>
    </div>
  );
}
