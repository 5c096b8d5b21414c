import { DATABASE_URL } from 'astro:env/server';
import { createDb } from './client';

// the app's one pool; created on first import of this module
const created = createDb(DATABASE_URL);

export const db = created.db;
export const pool = created.pool;
export * as tables from './schema';
