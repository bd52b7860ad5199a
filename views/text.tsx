/** @jsxImportSource hono/jsx */
/**
 * Helpers for showing untrusted text. JSX escapes every string it renders, so text is never
 * HTML; these only shorten it and make invisible characters visible.
 */
export function shortText(text: string, max: number): string {
  const flat = text.replace(/\s+/g, ' ').trim();
  return revealInvisible(flat.length <= max ? flat : `${flat.slice(0, max - 1)}…`);
}

/** Bidi controls and zero-width characters that can make text read differently than it is. */
const INVISIBLE = /[\u200B-\u200F\u202A-\u202E\u2060-\u2069\uFEFF]/g;

/** Replaces invisible and direction-changing characters with a visible code such as ⟦U+202E⟧. */
export function revealInvisible(text: string): string {
  return text.replace(INVISIBLE, (ch) => `⟦U+${ch.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}⟧`);
}

/** A block of model or user text: escaped, whitespace kept, invisible characters shown. */
export function UntrustedText({ text, class: className }: { text: string; class?: string }) {
  return <div class={`untrusted ${className ?? ''}`.trim()}>{revealInvisible(text)}</div>;
}
