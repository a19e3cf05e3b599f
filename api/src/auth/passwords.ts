import { hash, verify, Algorithm } from '@node-rs/argon2';

/** argon2id with 19 MiB and 2 passes: the minimum OWASP's password storage guidance recommends. */
export const ARGON2_OPTIONS = { algorithm: Algorithm.Argon2id, memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, ARGON2_OPTIONS);
}

export async function verifyPassword(hashed: string, password: string): Promise<boolean> {
  try {
    return await verify(hashed, password);
  } catch {
    return false;
  }
}

// Checked against for unknown e-mails so that a miss costs the same time as a wrong password.
let decoy: Promise<string> | undefined;
export function decoyHash(): Promise<string> {
  decoy ??= hashPassword('decoy-password-never-valid');
  return decoy;
}

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}
