// Plain, readable messages: a greeting, a few short paragraphs, one link to
// the record. The same content as text and as simple HTML (escaped).
export interface MailContent {
  subject: string;
  /** First line, e.g. "Hello Deniz Calloway,". */
  greeting: string;
  paragraphs: string[];
  link?: { label: string; url: string };
}

export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

const escapeHtml = (value: string) =>
  value.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');

const FOOTER = 'Whorl sends this message because of your role in the quality system. On the Messages page you can read every message it sent you and choose one daily digest instead of single messages.';

export function renderMail(content: MailContent): RenderedMail {
  const text = [
    content.greeting,
    '',
    ...content.paragraphs.flatMap((paragraph) => [paragraph, '']),
    ...(content.link ? [`${content.link.label}: ${content.link.url}`, ''] : []),
    '—',
    FOOTER,
  ].join('\n');
  const html = [
    '<!doctype html><html><body style="font-family: Lato, Arial, sans-serif; color: #1d2a33; line-height: 1.5">',
    `<p>${escapeHtml(content.greeting)}</p>`,
    ...content.paragraphs.map((paragraph) => `<p>${escapeHtml(paragraph)}</p>`),
    content.link ? `<p><a href="${escapeHtml(content.link.url)}">${escapeHtml(content.link.label)}</a></p>` : '',
    `<p style="color: #5b6b75; font-size: 12px">${escapeHtml(FOOTER)}</p>`,
    '</body></html>',
  ].join('\n');
  return { subject: content.subject, text, html };
}

/** An absolute link into the client from the configured public address. */
export function recordUrl(publicUrl: string, path: string): string {
  return new URL(path, publicUrl.endsWith('/') ? publicUrl : `${publicUrl}/`).toString();
}
