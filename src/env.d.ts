/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    /** the signed-in person, or null */
    user: import('lucia').User | null;
    /** the lucia session, or null */
    session: import('lucia').Session | null;
    /** a share link already checked and counted for this request by the middleware (the Shared view reads it) */
    shareCheck?: { token: string; result: import('./lib/server/services/shares').ShareCheck | import('./lib/server/services/teams').Fail };
  }
}
