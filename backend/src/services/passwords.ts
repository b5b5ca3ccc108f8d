import argon2 from 'argon2';

// argon2id with the library's defaults (64 MiB, t=3, p=4), the OWASP-recommended family.
export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, { type: argon2.argon2id });
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
