// The small HTML page a person sees after opening a link from one of our e-mails (unsubscribe, daily
// summaries off): styled like the e-mails, strict CSP, never cached.
import { randomBytes } from 'node:crypto';
import type { Response } from 'express';
import { MAIL_COLOURS, escapeHtml } from './layout';

/** A small page for a person who opened a link from an e-mail (used by other e-mails' links too). */
export function linkPage(
  res: Response,
  status: number,
  title: string,
  lines: string[],
  action?: { label: string; url: string },
) {
  const nonce = randomBytes(16).toString('base64');
  const C = MAIL_COLOURS;
  res.status(status);
  res.setHeader(
    'Content-Security-Policy',
    `default-src 'none'; style-src 'nonce-${nonce}'; font-src 'self'; form-action 'self'; frame-ancestors 'none'; base-uri 'none'`,
  );
  res.setHeader('Cache-Control', 'no-store');
  res.type('html').send(`<!doctype html><html lang="en"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width,initial-scale=1"><title>${escapeHtml(title)} · Rackturn</title>
<style nonce="${nonce}">
@font-face{font-family:Barlow;font-weight:400;font-display:swap;src:url(/api/email/font/400.woff2) format('woff2')}
@font-face{font-family:Barlow;font-weight:700;font-display:swap;src:url(/api/email/font/700.woff2) format('woff2')}
body{margin:0;min-height:100vh;display:flex;flex-direction:column;align-items:center;justify-content:center;background:${C.ink900};font-family:Barlow,'Helvetica Neue',Helvetica,Arial,sans-serif;padding:24px;box-sizing:border-box}
.mark{color:${C.chalk50};font-size:28px;font-weight:700;letter-spacing:.5px;margin-bottom:20px}
.mark span{display:inline-block;width:22px;height:13px;margin-right:8px;background:${C.chalk100};border-left:6px solid ${C.rust500};border-right:6px solid ${C.rust500};border-radius:2px;vertical-align:middle}
main{background:${C.chalk50};border-radius:8px;padding:24px;max-width:26rem;width:100%;box-sizing:border-box;color:${C.ink900}}
h1{margin:0 0 12px;font-size:24px}p{margin:0 0 12px;line-height:1.5}
button{font:inherit;font-weight:600;background:${C.chalk50};color:${C.ink900};border:1px solid ${C.ink700};border-radius:6px;padding:10px 16px;min-height:44px;cursor:pointer}
a{color:${C.ink700}}
</style></head><body><div class="mark"><span></span>Rackturn</div><main><h1>${escapeHtml(title)}</h1>
${lines.map((l) => `<p>${escapeHtml(l)}</p>`).join('')}
${action ? `<form method="post" action="${escapeHtml(action.url)}"><button type="submit">${escapeHtml(action.label)}</button></form>` : ''}
</main></body></html>`);
}
