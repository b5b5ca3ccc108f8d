import argon2 from 'argon2';

// argon2id at the OWASP Password Storage Cheat Sheet's first configuration (19 MiB, t=2,
// p=1; from memory): strong against offline guessing, ~50 ms per sign-in on one core.
const ARGON2_OPTIONS = { type: argon2.argon2id, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, ARGON2_OPTIONS);
}

export function verifyPassword(hash: string, password: string): Promise<boolean> {
  return argon2.verify(hash, password).catch(() => false);
}

// Verifying against a throwaway hash when the account does not exist keeps the response
// time of "no such user" the same as "wrong password".
let decoyHash: Promise<string> | undefined;
export async function verifyAgainstDecoy(password: string): Promise<false> {
  decoyHash ??= hashPassword('decoy password that nobody has');
  await verifyPassword(await decoyHash, password);
  return false;
}
