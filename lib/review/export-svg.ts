/**
 * Turns the plot's on-screen SVG markup into a file that stands alone: the page's CSS colour variables become their
 * values, the fonts fall back to generic families, and the paper background is drawn in, so the file looks the same
 * in any viewer (and rasterises the same on a canvas).
 */
export interface StandaloneSvgOptions {
  palette: Record<string, string>;
  background: string;
  width: number;
  height: number;
}

const SVG_NS = "http://www.w3.org/2000/svg";

export function standaloneSvg(markup: string, opts: StandaloneSvgOptions): string {
  const open = markup.match(/^<svg\b[^>]*>/);
  if (!open) throw new Error("export: markup does not start with an <svg> element");
  const resolved = markup.replace(/var\(\s*(--[\w-]+)\s*(?:,\s*([^)]+))?\)/g, (whole, name: string, fallback?: string) => opts.palette[name] ?? fallback?.trim() ?? whole);
  const attrs = open[0]
    .replace(/\s(width|height|xmlns|class)="[^"]*"/g, "")
    .replace(/^<svg/, `<svg xmlns="${SVG_NS}" width="${opts.width}" height="${opts.height}"`);
  const style = `<style>text{font-family:"Source Sans 3",ui-sans-serif,sans-serif}.num{font-family:"JetBrains Mono",ui-monospace,monospace}</style>`;
  const background = `<rect x="0" y="0" width="100%" height="100%" fill="${opts.background}"/>`;
  const body = resolved.slice(resolved.indexOf(">") + 1);
  return `<?xml version="1.0" encoding="UTF-8"?>\n${attrs}${style}${background}${body}`;
}
