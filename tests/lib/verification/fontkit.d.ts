// fontkit (a dependency of @react-pdf/renderer) ships no types; the tests use two calls of it.
declare module 'fontkit' {
  export interface Font {
    hasGlyphForCodePoint(codePoint: number): boolean;
  }
  export function create(buffer: Uint8Array): Font;
}
