import type { RenderedMarkdown } from "./render";

export interface RenderRequest {
  id: number;
  text: string;
}

export type RenderReply = { id: number; ok: true; rendered: RenderedMarkdown } | { id: number; ok: false; message: string };
