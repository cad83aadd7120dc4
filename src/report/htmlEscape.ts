const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/**
 * Text made safe for HTML and SVG, in element content and in quoted attributes alike (the five
 * characters XML reserves become entities).
 *
 * Syntax: htmlEscape(text)
 * Example: htmlEscape('R < 1 Ω & "C"')   // 'R &lt; 1 Ω &amp; &quot;C&quot;'
 */
export function htmlEscape(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ENTITIES[c]);
}
