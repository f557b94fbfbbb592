import { hash, verify } from "@node-rs/argon2";

// argon2id with the OWASP-recommended minimum (19 MiB memory, 2 iterations, 1 lane).
const options = { memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, { ...options, algorithm: 2 /* Argon2id */ });
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}
