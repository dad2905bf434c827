#!/usr/bin/env node
// Entry point of the `warpmeter` command: loads the TypeScript sources through tsx.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('./warpmeter.ts');
const status = await main(process.argv.slice(2), { stdin: process.stdin, stdout: process.stdout, stderr: process.stderr });
process.stdout.write('', () => process.exit(status));
