// The look of every e-mail: one HTML frame in the product's colours and type, and its plain-text twin.
// Every value put into the HTML is escaped; there are no images, remote resources or tracking of any kind.

export const MAIL_COLOURS = {
  ink900: '#111b2e',
  ink700: '#253553',
  ink500: '#52658c',
  ink300: '#a9b3c9',
  chalk50: '#fcfaf6',
  chalk100: '#f5f1e8',
  chalk300: '#dad0bb',
  rust500: '#c4582f',
  caution100: '#f8ecd0',
  caution700: '#87590f',
} as const;

/** Barlow where the reader has it, then common sans-serif faces. */
const FONT = "Barlow, 'Helvetica Neue', Helvetica, Arial, sans-serif";

/** HTML that is already safe (built by this module's helpers). */
export class SafeHtml {
  constructor(readonly value: string) {}
  toString() {
    return this.value;
  }
}

export function escapeHtml(value: unknown): string {
  return String(value).replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );
}

/** A template tag that escapes every interpolated value unless it is SafeHtml (or a list of them). */
export function html(strings: TemplateStringsArray, ...values: unknown[]): SafeHtml {
  let out = strings[0] ?? '';
  values.forEach((v, i) => {
    const parts = Array.isArray(v) ? v : [v];
    out += parts.map((p) => (p instanceof SafeHtml ? p.value : escapeHtml(p ?? ''))).join('');
    out += strings[i + 1] ?? '';
  });
  return new SafeHtml(out);
}

/** A block of the message body, rendered both ways. */
export type Block =
  | { type: 'paragraph'; text: string }
  | { type: 'heading'; text: string }
  | { type: 'button'; label: string; url: string }
  | { type: 'link'; label: string; url: string }
  | { type: 'list'; items: { title: string; lines: string[] }[]; empty?: string }
  | { type: 'caution'; lines: string[] };

export interface MailContent {
  subject: string;
  /** The first line a mail program shows beside the subject. */
  preheader: string;
  title: string;
  blocks: Block[];
  /** Small print under the card: why this mail came, how to stop it (links show their label only). */
  footer: Block[];
}

const p = (style: string, content: SafeHtml | string) => html`<p style="${new SafeHtml(style)}">${content}</p>`;

function blockHtml(b: Block): SafeHtml {
  const C = MAIL_COLOURS;
  switch (b.type) {
    case 'paragraph':
      return p(`margin:0 0 16px;font-size:16px;line-height:1.5;color:${C.ink900};`, b.text);
    case 'heading':
      return html`<h2 style="margin:24px 0 8px;font-size:18px;line-height:1.3;color:${C.ink900};">${b.text}</h2>`;
    case 'button':
      return html`<table role="presentation" cellpadding="0" cellspacing="0" style="margin:8px 0 20px;">
        <tr>
          <td style="border-radius:6px;background:${C.rust500};">
            <a
              href="${b.url}"
              style="display:inline-block;padding:12px 22px;font-family:${FONT};font-size:16px;font-weight:600;color:${C.chalk50};text-decoration:none;border-radius:6px;"
              >${b.label}</a
            >
          </td>
        </tr>
      </table>`;
    case 'link':
      return p(
        `margin:0 0 16px;font-size:13px;line-height:1.5;color:${C.ink500};word-break:break-all;`,
        html`${b.label} <a href="${b.url}" style="color:${C.ink700};">${b.url}</a>`,
      );
    case 'list':
      if (b.items.length === 0 && b.empty)
        return p(`margin:0 0 16px;font-size:16px;color:${C.ink500};font-style:italic;`, b.empty);
      return html`<table
        role="presentation"
        width="100%"
        cellpadding="0"
        cellspacing="0"
        style="margin:0 0 16px;border-collapse:collapse;"
      >
        ${b.items.map(
          (item) =>
            html`<tr>
              <td
                style="padding:10px 12px;border-left:4px solid ${C.rust500};background:${C.chalk100};border-bottom:6px solid ${C.chalk50};"
              >
                <div style="font-size:16px;font-weight:600;color:${C.ink900};">${item.title}</div>
                ${item.lines.map(
                  (l) =>
                    html`<div style="font-size:14px;line-height:1.45;color:${C.ink700};margin-top:2px;">${l}</div>`,
                )}
              </td>
            </tr>`,
        )}
      </table>`;
    case 'caution':
      return html`<div
        style="margin:8px 0 16px;padding:10px 12px;border-radius:6px;background:${C.caution100};color:${C.ink900};font-size:13px;line-height:1.5;"
      >
        <strong style="color:${C.caution700};">&#9888; Caution</strong>${b.lines.map((l) => html`<br />${l}`)}
      </div>`;
  }
}

function blockText(b: Block): string {
  switch (b.type) {
    case 'paragraph':
      return b.text;
    case 'heading':
      return `${b.text}\n${'-'.repeat(b.text.length)}`;
    case 'button':
      return `${b.label}:\n${b.url}`;
    case 'link':
      return `${b.label.replace(/:$/, '')}: ${b.url}`;
    case 'list':
      if (b.items.length === 0) return b.empty ?? '';
      return b.items.map((i) => [`* ${i.title}`, ...i.lines.map((l) => `  ${l}`)].join('\n')).join('\n');
    case 'caution':
      return ['Caution:', ...b.lines.map((l) => `  ${l}`)].join('\n');
  }
}

export function renderMail(content: MailContent): { subject: string; html: string; text: string } {
  const C = MAIL_COLOURS;
  const body = html`<!doctype html>
    <html lang="en">
      <head>
        <meta charset="utf-8" />
        <meta name="viewport" content="width=device-width,initial-scale=1" />
        <meta name="color-scheme" content="light" />
        <title>${content.subject}</title>
      </head>
      <body style="margin:0;padding:0;background:${C.ink900};font-family:${FONT};">
        <div style="display:none;max-height:0;overflow:hidden;opacity:0;">${content.preheader}</div>
        <table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="background:${C.ink900};">
          <tr>
            <td align="center" style="padding:28px 12px;">
              <table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="max-width:560px;">
                <tr>
                  <td
                    style="padding:0 4px 18px;font-family:${FONT};font-size:24px;font-weight:700;letter-spacing:0.5px;color:${C.chalk50};"
                  >
                    <span
                      style="display:inline-block;width:20px;height:12px;margin-right:8px;background:${C.chalk100};border-left:5px solid ${C.rust500};border-right:5px solid ${C.rust500};border-radius:2px;vertical-align:middle;"
                    ></span
                    >Rackturn
                  </td>
                </tr>
                <tr>
                  <td style="background:${C.chalk50};border-radius:8px;padding:28px 24px;font-family:${FONT};">
                    <h1 style="margin:0 0 16px;font-size:24px;line-height:1.25;color:${C.ink900};">${content.title}</h1>
                    ${content.blocks.map(blockHtml)}
                  </td>
                </tr>
                <tr>
                  <td style="padding:18px 4px 0;font-family:${FONT};font-size:12px;line-height:1.5;color:${C.ink300};">
                    ${content.footer.map((b) =>
                      b.type === 'link'
                        ? html`<p style="margin:0 0 8px;">
                            <a href="${b.url}" style="color:${C.chalk50};">${b.label}</a>
                          </p>`
                        : b.type === 'paragraph'
                          ? html`<p style="margin:0 0 8px;">${b.text}</p>`
                          : blockHtml(b),
                    )}
                  </td>
                </tr>
              </table>
            </td>
          </tr>
        </table>
      </body>
    </html>`;
  const text = [
    'RACKTURN',
    '',
    content.title,
    '='.repeat(Math.min(content.title.length, 72)),
    '',
    ...content.blocks.map((b) => `${blockText(b)}\n`),
    '--',
    ...content.footer.map(blockText),
    '',
  ].join('\n');
  return { subject: content.subject, html: body.value, text };
}
