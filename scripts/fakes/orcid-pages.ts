// The one page the ORCID sign-in fake shows: pick an invented researcher to sign in as. Plain on purpose.
import type { Researcher } from './orcid-researchers';

const escapeHtml = (text: string) =>
  text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

const STYLE = `body{font:16px/1.5 system-ui,sans-serif;max-width:40rem;margin:2rem auto;padding:0 1rem;color:#1e293b}
h1{font-size:1.3rem}ul{list-style:none;padding:0}li{border:1px solid #cbd5e1;border-radius:6px;padding:.75rem 1rem;margin:.5rem 0}
.id{font-family:monospace;color:#475569}button{font:inherit;padding:.4rem .9rem;border-radius:6px;border:1px solid #334155;background:#f8fafc;cursor:pointer}
.note{color:#475569;font-size:.9rem}`;

export function chooserPage(opts: { requestId: string; clientId: string; researchers: Researcher[] }): string {
  const items = opts.researchers
    .map((r) => {
      const name = `${r.givenName} ${r.familyName}`;
      const mail = r.email ? `${escapeHtml(r.email)} (${r.emailVerified ? 'confirmed' : 'not confirmed'})` : 'no e-mail released';
      return `<li><form method="post" action="/authorize/decide">
<input type="hidden" name="request" value="${escapeHtml(opts.requestId)}"><input type="hidden" name="orcid" value="${escapeHtml(r.orcid)}">
<strong>${escapeHtml(name)}</strong> · ${escapeHtml(r.affiliation)}<br><span class="id">${escapeHtml(r.orcid)}</span> · <span class="note">${mail}</span><br>
<button type="submit">Sign in as ${escapeHtml(name)}</button></form></li>`;
    })
    .join('\n');
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Local ORCID sign-in (test identities)</title><style>${STYLE}</style></head><body>
<h1>Local ORCID sign-in for development</h1>
<p class="note">This stand-in runs on your machine so Ohmstead can be tried without the real service. Every researcher below is invented,
and their iDs are in a block that is never issued. The application <code>${escapeHtml(opts.clientId)}</code> asks who you are.</p>
<ul>${items}</ul>
<form method="post" action="/authorize/decide"><input type="hidden" name="request" value="${escapeHtml(opts.requestId)}">
<input type="hidden" name="deny" value="1"><button type="submit">Cancel and go back</button></form>
</body></html>`;
}

export function errorPage(message: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Sign-in request refused</title><style>${STYLE}</style></head>
<body><h1>This sign-in request was refused</h1><p>${escapeHtml(message)}</p></body></html>`;
}
