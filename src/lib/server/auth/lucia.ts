import { Lucia, TimeSpan } from 'lucia';
import { DrizzleMySQLAdapter } from '@lucia-auth/adapter-drizzle';
import { PUBLIC_BASE_URL } from 'astro:env/server';
import { db } from '../db';
import { sessions, users } from '../db/schema';

const adapter = new DrizzleMySQLAdapter(db, sessions, users);

export const lucia = new Lucia(adapter, {
  sessionExpiresIn: new TimeSpan(14, 'd'),
  sessionCookie: {
    name: 'wallpulse_session',
    attributes: {
      // Secure whenever the public address is https (behind a proxy too); SameSite=Lax and HttpOnly are lucia's defaults
      secure: PUBLIC_BASE_URL.startsWith('https://'),
      sameSite: 'lax',
    },
  },
  getUserAttributes: (attributes) => ({
    email: attributes.email,
    name: attributes.name,
    // the drizzle adapter hands back the row with the schema's camelCase keys
    emailVerified: attributes.emailVerifiedAt !== null && attributes.emailVerifiedAt !== undefined,
  }),
});

declare module 'lucia' {
  interface Register {
    Lucia: typeof lucia;
    DatabaseUserAttributes: { email: string; name: string; emailVerifiedAt: Date | null };
  }
}
