import type { Role } from '@shared/schemas/user';

declare global {
  namespace Express {
    interface User {
      id: number;
      name: string;
      email: string;
      role: Role;
      active: boolean;
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
    lastSeen?: number;
  }
}

export {};
