import 'next-auth';
import 'next-auth/jwt';

declare module 'next-auth' {
  interface User {
    id: string;
    sessionVersion: number;
  }
  interface Session {
    user: {
      id: string;
      name: string;
      email: string;
    };
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid: string;
    /** The person's session_version at sign-in; a raised one ends this session. */
    sv: number;
  }
}
