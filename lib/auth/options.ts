import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import bcrypt from 'bcryptjs';
import { z } from 'zod';
import { db } from '@/db/models';
import type { Role } from '@/db/models';
import { env } from '@/lib/env';
import { safeRedirectUrl } from '@/lib/security/redirect';
import { PASSWORD_MAX_BYTES, passwordBytes } from '@/lib/account/schema';

const Credentials = z.object({
  email: z.string().trim().toLowerCase().email(),
  // Longer than bcrypt reads: no password set through Brixhouse is, so it cannot match.
  password: z.string().min(1).refine((p) => passwordBytes(p) <= PASSWORD_MAX_BYTES),
});

// Compared against when no user matches, so a wrong e-mail costs as long as a wrong password.
let dummyHash: string | undefined;
const fallbackHash = () => (dummyHash ??= bcrypt.hashSync('no-such-user', 10));

export const authOptions: NextAuthOptions = {
  secret: env().NEXTAUTH_SECRET,
  session: { strategy: 'jwt', maxAge: 60 * 60 * 24 * 30 },
  pages: { signIn: '/sign-in' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: {
        email: { label: 'E-mail', type: 'email' },
        password: { label: 'Password', type: 'password' },
      },
      async authorize(raw) {
        const parsed = Credentials.safeParse(raw);
        if (!parsed.success) return null;
        const { User } = db();
        const user = await User.findOne({ where: { email: parsed.data.email } });
        const ok = await bcrypt.compare(parsed.data.password, user?.passwordHash ?? fallbackHash());
        if (!user || !user.passwordHash || !ok) return null;
        return { id: user.id, name: user.name, email: user.email, sessionVersion: user.sessionVersion };
      },
    }),
  ],
  // The token names the person and the generation of their sessions, nothing more: role,
  // household and cooperative are read from the database on every request (lib/server/context).
  callbacks: {
    // Only addresses on this site: `/\evil.example` and friends end on the home page.
    async redirect({ url, baseUrl }) {
      return safeRedirectUrl(url, baseUrl);
    },
    async jwt({ token, user }) {
      if (user) {
        token.uid = user.id;
        token.sv = user.sessionVersion;
      }
      return token;
    },
    async session({ session, token }) {
      session.user = { id: token.uid, name: token.name ?? '', email: token.email ?? '' };
      return session;
    },
  },
};

export type { Role };
