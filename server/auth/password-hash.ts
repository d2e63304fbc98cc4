import { hash, verify, Algorithm } from '@node-rs/argon2';

// argon2id with OWASP Password Storage Cheat Sheet parameters (m=19 MiB, t=2, p=1; ASVS 4.0.3 2.4.1).
const OPTIONS = { algorithm: Algorithm.Argon2id, memoryCost: 19456, timeCost: 2, parallelism: 1 };

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

export async function verifyPassword(hashed: string, password: string): Promise<boolean> {
  try {
    return await verify(hashed, password);
  } catch {
    // A malformed stored hash is treated as a mismatch rather than a crash.
    return false;
  }
}

/** Spent on unknown e-mails so a wrong address takes as long as a wrong password. */
let dummyHash: Promise<string> | undefined;
export async function burnVerifyTime(password: string): Promise<void> {
  dummyHash ??= hashPassword('padside-timing-equaliser-value');
  await verifyPassword(await dummyHash, password);
}
