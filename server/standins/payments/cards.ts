// Test card numbers of the local payments fake, and what each one does. Only these are accepted;
// the fake keeps the last four digits and the behaviour, never the number itself.

export type CardBehaviour = 'succeeds' | 'declined' | 'fails_at_renewal';

export const TEST_CARDS: { number: string; behaviour: CardBehaviour; label: string }[] = [
  { number: '4111 2222 3333 4448', behaviour: 'succeeds', label: 'Pays now and at every renewal' },
  { number: '4111 2222 3333 5551', behaviour: 'declined', label: 'Declined at checkout' },
  { number: '4111 2222 3333 6666', behaviour: 'fails_at_renewal', label: 'Pays now, fails at the next renewal' },
];

export const SUCCEEDING_CARD = TEST_CARDS[0]!.number;
export const DECLINED_CARD = TEST_CARDS[1]!.number;
export const RENEWAL_FAILING_CARD = TEST_CARDS[2]!.number;

export function digitsOf(number: string): string {
  return number.replace(/[\s-]/g, '');
}

/** The Luhn checksum every payment card number carries (ISO/IEC 7812-1). */
export function luhnValid(digits: string): boolean {
  if (!/^\d{12,19}$/.test(digits)) return false;
  let sum = 0;
  for (let i = 0; i < digits.length; i++) {
    let d = Number(digits[digits.length - 1 - i]);
    if (i % 2 === 1) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return sum % 10 === 0;
}

export type CardCheck =
  | { ok: true; behaviour: CardBehaviour; last4: string; expMonth: number; expYear: number }
  | { ok: false; field: 'number' | 'expiry' | 'cvc' | 'name'; message: string };

/** Checks what was typed on the test checkout page the way a card form would. */
export function checkCard(
  input: { number?: string; expiry?: string; cvc?: string; name?: string },
  now = new Date(),
): CardCheck {
  const digits = digitsOf(input.number ?? '');
  if (!luhnValid(digits)) return { ok: false, field: 'number', message: 'This card number is not valid.' };
  const exp = /^\s*(\d{1,2})\s*\/\s*(\d{2}|\d{4})\s*$/.exec(input.expiry ?? '');
  const month = exp ? Number(exp[1]) : 0;
  const year = exp ? (exp[2]!.length === 2 ? 2000 + Number(exp[2]) : Number(exp[2])) : 0;
  if (!exp || month < 1 || month > 12) return { ok: false, field: 'expiry', message: 'Enter the expiry as MM/YY.' };
  const lastValid = Date.UTC(year, month, 1); // the card works through the end of its expiry month
  if (lastValid <= now.getTime()) return { ok: false, field: 'expiry', message: 'This card has expired.' };
  if (!/^\d{3,4}$/.test((input.cvc ?? '').trim()))
    return { ok: false, field: 'cvc', message: 'Enter the 3 or 4 digits from the back.' };
  if (!(input.name ?? '').trim()) return { ok: false, field: 'name', message: 'Enter the name on the card.' };
  const card = TEST_CARDS.find((c) => digitsOf(c.number) === digits);
  if (!card) {
    return { ok: false, field: 'number', message: 'This test checkout only takes the test cards listed below.' };
  }
  return { ok: true, behaviour: card.behaviour, last4: digits.slice(-4), expMonth: month, expYear: year };
}
