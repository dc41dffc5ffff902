import type { DefaultSession } from 'next-auth';

declare module 'next-auth' {
  interface Session {
    user: { id: number; isAdmin: boolean } & DefaultSession['user'];
  }
  interface User {
    id: string;
    isAdmin?: boolean;
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid?: number;
    isAdmin?: boolean;
  }
}
