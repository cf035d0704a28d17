// The last resort for a code no label map knows yet (an event added by a newer
// server, say): words instead of the code, never the code itself.
export function humanizeCode(code: string): string {
  const words = code
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/[_-]+/g, ' ')
    .trim()
    .toLowerCase();
  return words ? words[0].toUpperCase() + words.slice(1) : code;
}
