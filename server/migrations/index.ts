import { Foundation1796173214798 } from './1796173214798-Foundation.js';
import { AuditWorkflow1796173531349 } from './1796173531349-AuditWorkflow.js';
import { ReviewSignOff1796173789430 } from './1796173789430-ReviewSignOff.js';
import { SeatBilling1796174078060 } from './1796174078060-SeatBilling.js';

/** Every migration class in order, listed explicitly (globs break under vitest). Append new ones here. */
export const migrations: Function[] = [Foundation1796173214798, AuditWorkflow1796173531349, ReviewSignOff1796173789430, SeatBilling1796174078060];
