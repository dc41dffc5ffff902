import bcrypt from 'bcryptjs';
import { getDb } from '@/lib/db';

export interface VerifiedUser {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
}

// A real hash of a random string, compared when the e-mail is unknown so that a failed
// sign-in takes the same time whether or not the account exists.
const TIMING_DECOY = '$2b$10$CwTycUXWue0Thq9StjUM0uJ8.d6mC1S0w8yuHkqXCQkCU8JYxqE9K';

/** Checks an e-mail and password against an active account; null when they do not match. */
export async function verifyCredentials(email: string, password: string): Promise<VerifiedUser | null> {
  const { models } = getDb();
  const user = await models.User.scope('withPassword').findOne({ where: { email: email.trim().toLowerCase() } });
  const ok = await bcrypt.compare(password, user?.passwordHash ?? TIMING_DECOY);
  if (!user || !ok || !user.active) return null;
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin };
}
