#!/usr/bin/env node
// `npm run build`: compile the server parts and build the web app (npm start does this too).
import * as path from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildAll } from './lib/build.mjs';

buildAll(path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..'));
