import 'server-only';
import bcrypt from 'bcryptjs';

const COST = 12;
// A real hash of a random string, compared when the account does not exist, so that
// "no such account" takes as long as "wrong password".
const DUMMY_HASH = '$2b$12$C6UzMDM.H6dfI/f/IKxGhuJ7D1x4r5rDS0xkPa3Lxh0WUjbtQbNZm';

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

export async function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  const ok = await bcrypt.compare(password, hash ?? DUMMY_HASH);
  return ok && Boolean(hash);
}
