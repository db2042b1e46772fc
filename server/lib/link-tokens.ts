// Tokens carried by links in e-mails. Single-use links (invitations, password resets) carry 32 random
// bytes and only their SHA-256 is stored; the unsubscribe link is a signed token naming its purpose.
import { createHash, randomBytes } from 'node:crypto';
import { SignJWT, jwtVerify } from 'jose';

export function newLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashLinkToken(token) };
}

export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** Only weekly-plan unsubscribe tokens carry this; sessions and other tokens are refused. */
export const UNSUBSCRIBE_PURPOSE = 'weekly-email-unsubscribe';
const UNSUBSCRIBE_TTL = '400d';

const keyOf = (secret: string) => new TextEncoder().encode(secret);

/** A signed token naming its purpose and user, for links in e-mails that act without signing in. */
export function signPurposeToken(secret: string, purpose: string, userId: number): Promise<string> {
  return new SignJWT({ purpose })
    .setProtectedHeader({ alg: 'HS256' })
    .setSubject(String(userId))
    .setIssuedAt()
    .setExpirationTime(UNSUBSCRIBE_TTL)
    .sign(keyOf(secret));
}

/** The user id a purpose token was made for, or null when forged, expired or made for another purpose. */
export async function verifyPurposeToken(secret: string, purpose: string, token: string): Promise<number | null> {
  try {
    const { payload } = await jwtVerify(token, keyOf(secret), { algorithms: ['HS256'] });
    if (payload.purpose !== purpose) return null;
    const userId = Number(payload.sub);
    return Number.isSafeInteger(userId) && userId > 0 ? userId : null;
  } catch {
    return null;
  }
}

export function signUnsubscribeToken(secret: string, userId: number): Promise<string> {
  return signPurposeToken(secret, UNSUBSCRIBE_PURPOSE, userId);
}

/** The user id the token was made for, or null when it is forged, expired or made for something else. */
export function verifyUnsubscribeToken(secret: string, token: string): Promise<number | null> {
  return verifyPurposeToken(secret, UNSUBSCRIBE_PURPOSE, token);
}

/** An absolute link into the app. */
export function appLink(origin: string, path: string, query: Record<string, string> = {}): string {
  const url = new URL(path, origin);
  for (const [k, v] of Object.entries(query)) url.searchParams.set(k, v);
  return url.toString();
}
