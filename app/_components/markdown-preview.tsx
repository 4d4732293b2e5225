import { memo } from "react";
import ReactMarkdown from "react-markdown";
import { USER_MARKDOWN_REHYPE_PLUGINS, USER_MARKDOWN_REMARK_PLUGINS } from "@/lib/markdown/plugins";
import { MARKDOWN_CLASS } from "./markdown";

/**
 * User markdown rendered in the browser while it is written, with the plugin list the server stores it with:
 * the same math bounds, sanitizer and image and link rules, so the preview shows what will be stored.
 */
export const MarkdownPreview = memo(function MarkdownPreview({ text }: { text: string }) {
  return (
    <div className={MARKDOWN_CLASS}>
      <ReactMarkdown remarkPlugins={USER_MARKDOWN_REMARK_PLUGINS} rehypePlugins={USER_MARKDOWN_REHYPE_PLUGINS}>
        {text}
      </ReactMarkdown>
    </div>
  );
});
