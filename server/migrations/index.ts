import { Foundation1796173214798 } from './1796173214798-Foundation.js';

/** Every migration class in order, listed explicitly (globs break under vitest). Append new ones here. */
export const migrations: Function[] = [Foundation1796173214798];
