import { html, safeHref, type SafeHtml } from './html';

// Every notification is a list of blocks rendered twice: plain text and HTML (escaped through lib/notify/html).

export type MailBlock =
  | { kind: 'p'; text: string }
  /** Someone's own words (a curator's comment), kept line by line. */
  | { kind: 'quote'; text: string }
  | { kind: 'facts'; items: [label: string, value: string][] }
  | { kind: 'link'; label: string; url: string }
  | { kind: 'citation'; text: string };

export type MailContent = { subject: string; blocks: MailBlock[] };
export type RenderedMail = { subject: string; text: string; html: string };

const FOOTER = 'You receive this message because of your role in a dataset on Ohmstead.';
const ACCENT = '#b4663a'; // Ohmstead's copper accent
const INK = '#1e293b'; // slate

/** Subjects are one line: header folding and CR/LF injection are not possible. */
function oneLine(text: string): string {
  return text.replace(/[\r\n\t]+/g, ' ').replace(/\s{2,}/g, ' ').trim();
}

function textBlock(b: MailBlock): string {
  switch (b.kind) {
    case 'p': return b.text;
    case 'quote': return b.text.split(/\r?\n/).map((l) => `> ${l}`).join('\n');
    case 'facts': return b.items.map(([k, v]) => `${k}: ${v}`).join('\n');
    case 'link': return `${b.label}: ${b.url}`;
    case 'citation': return b.text;
  }
}

function lines(text: string): SafeHtml {
  return html`${text.split(/\r?\n/).map((l, i) => (i === 0 ? html`${l}` : html`<br>${l}`))}`;
}

function htmlBlock(b: MailBlock): SafeHtml {
  switch (b.kind) {
    case 'p': return html`<p style="margin:0 0 14px">${b.text}</p>`;
    case 'quote':
      return html`<blockquote style="margin:0 0 14px;padding:8px 12px;border-left:3px solid ${ACCENT};background:#f8fafc">${lines(b.text)}</blockquote>`;
    case 'facts':
      return html`<table role="presentation" style="margin:0 0 14px;border-collapse:collapse">${b.items.map(
        ([k, v]) => html`<tr><td style="padding:2px 12px 2px 0;color:#64748b">${k}</td><td style="padding:2px 0">${v}</td></tr>`,
      )}</table>`;
    case 'link': {
      const href = safeHref(b.url);
      return href
        ? html`<p style="margin:0 0 14px"><a href="${href}" style="color:${ACCENT}">${b.label}</a></p>`
        : html`<p style="margin:0 0 14px">${b.label}: ${b.url}</p>`;
    }
    case 'citation':
      return html`<p style="margin:0 0 14px;padding:8px 12px;background:#f1f5f9;font-family:'IBM Plex Mono',monospace;font-size:13px">${b.text}</p>`;
  }
}

/** The plain-text and HTML parts of one notification. */
export function renderMail(content: MailContent): RenderedMail {
  const subject = oneLine(content.subject);
  // "-- " (with the space) is the usual signature separator that mail readers recognise.
  const text = [...content.blocks.map(textBlock), `-- \n${FOOTER}`].join('\n\n') + '\n';
  const body = html`<!doctype html><html><head><meta charset="utf-8"><title>${subject}</title></head><body style="margin:0;padding:24px;font-family:'IBM Plex Sans',Arial,sans-serif;font-size:15px;line-height:1.5;color:${INK}"><div style="max-width:560px">${content.blocks.map(htmlBlock)}<p style="margin:24px 0 0;font-size:12px;color:#64748b">${FOOTER}</p></div></body></html>`;
  return { subject, text, html: body.value };
}
