import type { Role } from '@/models/user';

declare module 'next-auth' {
  interface User {
    id: string;
    role: Role;
    organisationId: string;
  }
  interface Session {
    user: {
      id: string;
      role: Role;
      organisationId: string;
      name?: string | null;
      email?: string | null;
    };
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    userId: string;
    role: Role;
    organisationId: string;
  }
}
