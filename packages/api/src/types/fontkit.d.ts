// fontkit (pdfkit's font engine) ships no types: the little pdf-document.ts uses of it.
declare module 'fontkit' {
  export interface Font {
    postscriptName: string;
    layout(text: string, features?: unknown): unknown;
  }
  export function create(buffer: Buffer, postscriptName?: string): Font | { fonts: Font[] };
}
