import bcrypt from 'bcryptjs';

const COST = 10;
// Compared against when no user matches, so that an unknown e-mail costs the same time as a wrong password.
const DUMMY_HASH = bcrypt.hashSync('femtoslot-timing-equaliser', COST);

export const hashPassword = (plain: string) => bcrypt.hash(plain, COST);

export async function verifyPassword(plain: string, hash: string | null | undefined): Promise<boolean> {
  if (!hash) {
    await bcrypt.compare(plain, DUMMY_HASH);
    return false;
  }
  return bcrypt.compare(plain, hash);
}
