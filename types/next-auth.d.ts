import type { Role } from '@/lib/roles';

declare module 'next-auth' {
  interface User {
    id: string;
    role: Role;
    cooperativeId: string;
    householdId: string | null;
  }
  interface Session {
    user: {
      id: string;
      name: string;
      email: string;
      role: Role;
      cooperativeId: string;
      householdId: string | null;
    };
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid: string;
    role: Role;
    cooperativeId: string;
    householdId: string | null;
  }
}
