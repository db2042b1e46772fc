// The local payments fake's hosted checkout page: plain server-rendered HTML with no script, clearly
// marked as a local test, where one of the test cards is typed.
import { TEST_CARDS } from './cards';

const esc = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function money(minor: number, currency: string): string {
  const code = currency.toUpperCase();
  const digits = new Intl.NumberFormat('en', { style: 'currency', currency: code }).resolvedOptions()
    .maximumFractionDigits;
  return new Intl.NumberFormat('en-GB', { style: 'currency', currency: code }).format(minor / 10 ** (digits ?? 2));
}

const STYLE = `
*{box-sizing:border-box}
body{margin:0;font:16px/1.45 system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;background:#eef1f4;color:#1b2430}
.band{background:repeating-linear-gradient(135deg,#2b3a4a 0 14px,#33465a 14px 28px);color:#fff;padding:10px 16px;text-align:center;font-weight:600;letter-spacing:.02em}
.band small{display:block;font-weight:400;opacity:.85}
main{max-width:880px;margin:24px auto;padding:0 16px;display:grid;gap:20px;grid-template-columns:1fr;grid-template-areas:"sum" "pay" "cards"}
@media(min-width:760px){main{grid-template-columns:1fr 1.2fr;grid-template-areas:"sum pay" "cards pay";align-items:start}}
.sum{grid-area:sum}.pay{grid-area:pay}.cards{grid-area:cards}
.panel{background:#fff;border:2px dashed #8aa0b6;border-radius:10px;padding:20px}
h1,h2{font-size:1.15rem;margin:0 0 4px}
.amount{font-size:2rem;font-weight:700;margin:8px 0 0}
.per{color:#52606e}
label{display:block;font-weight:600;font-size:.92rem;margin:14px 0 4px}
input{width:100%;font:inherit;padding:10px 12px;border:1px solid #9aa8b6;border-radius:6px;background:#fbfcfd}
input[aria-invalid=true]{border-color:#b42318}
.row{display:grid;grid-template-columns:1fr 1fr;gap:12px}
.err{color:#b42318;font-size:.9rem;margin:4px 0 0}
.alert{border:1px solid #b42318;background:#fdecea;color:#7a1a12;border-radius:6px;padding:10px 12px;margin:0 0 8px;font-weight:600}
.ok{border:1px solid #2e7d4f;background:#e6f4ec;color:#1f5a38;border-radius:6px;padding:10px 12px}
button{margin-top:18px;width:100%;min-height:48px;font:inherit;font-weight:700;border:0;border-radius:6px;background:#1f6f78;color:#fff;cursor:pointer}
button:hover{background:#175960}
a{color:#1f5f8b}
table{width:100%;border-collapse:collapse;font-size:.9rem;margin-top:8px}
td,th{text-align:left;padding:6px 4px;border-top:1px solid #dde3e9;vertical-align:top}
code{font:600 .95rem/1.4 ui-monospace,Menlo,Consolas,monospace;white-space:nowrap;letter-spacing:.02em}
.muted{color:#52606e;font-size:.88rem}
`;

function frame(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>${esc(title)}</title><style>${STYLE}</style></head><body>
<div class="band" role="note">LOCAL TEST CHECKOUT — no real payment is made<small>A stand-in for the payment provider, for development and tests only.</small></div>
${body}</body></html>`;
}

export interface CheckoutView {
  sessionId: string;
  productName: string;
  unitAmount: number;
  currency: string;
  cancelUrl: string;
  values?: { name?: string; expiry?: string };
  error?: { field: string; message: string };
  declined?: boolean;
}

export function checkoutPage(v: CheckoutView): string {
  const fieldError = (field: string) =>
    v.error?.field === field ? `<p class="err" id="${field}-err">${esc(v.error.message)}</p>` : '';
  const invalid = (field: string) =>
    v.error?.field === field ? ` aria-invalid="true" aria-describedby="${field}-err"` : '';
  const cards = TEST_CARDS.map((c) => `<tr><td><code>${esc(c.number)}</code></td><td>${esc(c.label)}</td></tr>`).join(
    '',
  );
  return frame(
    'Test checkout',
    `<main>
<section class="panel sum" aria-labelledby="summary">
  <h1 id="summary">Monthly fee</h1>
  <p>${esc(v.productName)}</p>
  <p class="amount">${esc(money(v.unitAmount, v.currency))}</p>
  <p class="per">every month until cancelled</p>
</section>
<section class="panel cards" aria-labelledby="cards">
  <h2 id="cards">Test cards</h2>
  <p class="muted">Any future expiry and any three digits as the security code.</p>
  <table aria-labelledby="cards"><tbody>${cards}</tbody></table>
</section>
<section class="panel pay" aria-labelledby="pay">
  <h1 id="pay">Card details</h1>
  ${v.declined ? `<p class="alert" role="alert">The card was declined. Nothing was charged — try another card.</p>` : ''}
  <form method="post" action="/test-checkout/${esc(v.sessionId)}" novalidate>
    <label for="number">Card number</label>
    <input id="number" name="number" inputmode="numeric" autocomplete="cc-number" placeholder="1234 1234 1234 1234"${invalid('number')}>
    ${fieldError('number')}
    <div class="row">
      <div><label for="expiry">Expiry (MM/YY)</label>
      <input id="expiry" name="expiry" inputmode="numeric" autocomplete="cc-exp" placeholder="MM/YY" value="${esc(v.values?.expiry ?? '')}"${invalid('expiry')}>
      ${fieldError('expiry')}</div>
      <div><label for="cvc">Security code</label>
      <input id="cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" placeholder="123"${invalid('cvc')}>
      ${fieldError('cvc')}</div>
    </div>
    <label for="name">Name on card</label>
    <input id="name" name="name" autocomplete="cc-name" value="${esc(v.values?.name ?? '')}"${invalid('name')}>
    ${fieldError('name')}
    <button type="submit">Pay ${esc(money(v.unitAmount, v.currency))} a month</button>
  </form>
  <p><a href="${esc(v.cancelUrl)}">Cancel and go back</a></p>
</section>
</main>`,
  );
}

export function messagePage(title: string, message: string, link?: { href: string; label: string }): string {
  return frame(
    title,
    `<main><section class="panel"><h1>${esc(title)}</h1><p>${esc(message)}</p>${
      link ? `<p><a href="${esc(link.href)}">${esc(link.label)}</a></p>` : ''
    }</section></main>`,
  );
}
