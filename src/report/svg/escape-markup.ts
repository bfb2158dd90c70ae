const ENTITIES: Readonly<Record<string, string>> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

/**
 * Escapes text for SVG or HTML: safe as element content and inside quoted
 * attribute values. Every user-supplied string passes through here.
 */
export function escapeMarkup(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ENTITIES[c]);
}
