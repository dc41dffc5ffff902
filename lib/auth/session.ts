import { getServerSession } from 'next-auth';
import { authOptions } from './options';

/** The signed-in user's id from the session cookie, or null. */
export async function currentUserId(): Promise<number | null> {
  const session = await getServerSession(authOptions);
  const id = session?.user?.id;
  return typeof id === 'number' && Number.isInteger(id) ? id : null;
}
