import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { verifyCredentials } from '@/lib/data/users';
import { env } from '@/lib/env';
import { signInSchema } from '@/lib/validation/sign-in';

export const authOptions: NextAuthOptions = {
  secret: env().NEXTAUTH_SECRET,
  session: { strategy: 'jwt', maxAge: 12 * 60 * 60 },
  pages: { signIn: '/sign-in' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: {
        email: { label: 'E-mail', type: 'email' },
        password: { label: 'Password', type: 'password' },
      },
      async authorize(raw) {
        const parsed = signInSchema.safeParse(raw);
        if (!parsed.success) return null;
        const user = await verifyCredentials(parsed.data.email, parsed.data.password);
        if (!user) return null;
        return { id: String(user.id), email: user.email, name: user.name, isAdmin: user.isAdmin };
      },
    }),
  ],
  callbacks: {
    // STACK.md pitfall 10: copy the id into the token, expose it in the session.
    async jwt({ token, user }) {
      if (user) {
        token.uid = Number(user.id);
        token.isAdmin = !!user.isAdmin;
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user && typeof token.uid === 'number') {
        session.user.id = token.uid;
        session.user.isAdmin = !!token.isAdmin;
      }
      return session;
    },
  },
};
