import { hash, verify } from "@node-rs/argon2";

// argon2id with the library's defaults (19 MiB, 2 passes), the current recommended minimum.
export function hashPassword(password: string): Promise<string> {
  return hash(password); // argon2id is the library default
}

// A hash to verify against when the e-mail is unknown, so both cases cost the same time.
let dummy: Promise<string> | undefined;

export async function checkPassword(passwordHash: string | null | undefined, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash ?? (await (dummy ??= hashPassword("no account has this password"))), password);
  } catch {
    return false;
  }
}
