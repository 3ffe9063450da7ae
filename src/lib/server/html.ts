/** Escaping text for HTML we write by hand (mail bodies, the plain error pages). */

/** Replaces the five characters HTML gives meaning to with numeric character references. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}
