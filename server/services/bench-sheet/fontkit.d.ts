/** fontkit 2 ships no types; the bench sheet only parses a font and hands it to pdfkit. */
declare module 'fontkit' {
  export interface Font {
    readonly postscriptName: string;
    layout(text: string): unknown;
  }
  export function create(buffer: Uint8Array, postscriptName?: string): Font;
}
