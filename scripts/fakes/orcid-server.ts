// HTTP side of the ORCID sign-in fake: discovery, the researcher chooser, token, JWKS and userinfo endpoints.
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { OrcidFakeProvider } from './orcid-oidc';
import { chooserPage, errorPage } from './orcid-pages';
import { RESEARCHERS } from './orcid-researchers';

const MAX_BODY = 64 * 1024;

function sendJson(res: ServerResponse, status: number, body: object, extra: Record<string, string> = {}): void {
  res.writeHead(status, { 'Content-Type': 'application/json', 'Cache-Control': 'no-store', Pragma: 'no-cache', ...extra }).end(JSON.stringify(body));
}

function sendHtml(res: ServerResponse, status: number, html: string): void {
  res.writeHead(status, { 'Content-Type': 'text/html; charset=utf-8', 'Cache-Control': 'no-store' }).end(html);
}

async function readForm(req: IncomingMessage): Promise<URLSearchParams | null> {
  if (!(req.headers['content-type'] ?? '').startsWith('application/x-www-form-urlencoded')) return null;
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const c of req as AsyncIterable<Buffer>) {
    size += c.length;
    if (size > MAX_BODY) return null;
    chunks.push(c);
  }
  return new URLSearchParams(Buffer.concat(chunks).toString('utf8'));
}

/** RFC 6749 §2.3.1: client_id and client_secret are form-urlencoded before they go into Basic auth. */
function basicAuth(req: IncomingMessage): { id: string; secret: string } | null {
  const m = /^Basic\s+(.+)$/i.exec(req.headers.authorization ?? '');
  if (!m) return null;
  const decoded = Buffer.from(m[1]!, 'base64').toString('utf8');
  const colon = decoded.indexOf(':');
  if (colon < 0) return null;
  const un = (s: string) => decodeURIComponent(s.replace(/\+/g, ' '));
  return { id: un(decoded.slice(0, colon)), secret: un(decoded.slice(colon + 1)) };
}

export function createOrcidHandler(provider: OrcidFakeProvider) {
  return async (req: IncomingMessage, res: ServerResponse): Promise<void> => {
    try {
      const url = new URL(req.url ?? '/', provider.issuer);
      const route = `${req.method} ${url.pathname}`;
      switch (route) {
        case 'GET /.well-known/openid-configuration':
          return sendJson(res, 200, provider.discovery());
        case 'GET /jwks':
          return sendJson(res, 200, { keys: [provider.publicJwk] });
        case 'GET /authorize': {
          const started = provider.startAuthorization(url.searchParams);
          if ('page' in started) return sendHtml(res, 400, errorPage(started.page));
          if ('redirect' in started) return void res.writeHead(302, { Location: started.redirect }).end();
          return sendHtml(res, 200, chooserPage({ requestId: started.requestId, clientId: provider.client.clientId, researchers: RESEARCHERS }));
        }
        case 'POST /authorize/decide': {
          const form = await readForm(req);
          if (!form) return sendHtml(res, 400, errorPage('Expected a form post.'));
          const decided = provider.decide(form.get('request') ?? '', form.get('deny') ? null : (form.get('orcid') ?? ''));
          if ('page' in decided) return sendHtml(res, 400, errorPage(decided.page));
          return void res.writeHead(302, { Location: decided.redirect }).end();
        }
        case 'POST /token': {
          const form = await readForm(req);
          if (!form) return sendJson(res, 400, { error: 'invalid_request', error_description: 'expected application/x-www-form-urlencoded' });
          const result = await provider.exchangeCode(form, basicAuth(req));
          const challenge: Record<string, string> = result.status === 401 ? { 'WWW-Authenticate': 'Basic realm="token"' } : {};
          return sendJson(res, result.status, result.body, challenge);
        }
        case 'GET /userinfo':
        case 'POST /userinfo': {
          const token = /^Bearer\s+(\S+)$/i.exec(req.headers.authorization ?? '')?.[1] ?? '';
          const info = provider.userinfo(token);
          if (!info) return sendJson(res, 401, { error: 'invalid_token' }, { 'WWW-Authenticate': 'Bearer error="invalid_token"' });
          return sendJson(res, 200, info);
        }
        default:
          return sendJson(res, 404, { error: 'not_found', error_description: `${route} is not an endpoint of this provider` });
      }
    } catch (error) {
      console.error('ORCID fake error:', error);
      if (!res.headersSent) sendJson(res, 500, { error: 'server_error' });
    }
  };
}
