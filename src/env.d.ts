/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    /** the signed-in person, or null */
    user: import('lucia').User | null;
    /** the lucia session, or null */
    session: import('lucia').Session | null;
  }
}
