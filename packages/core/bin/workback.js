#!/usr/bin/env node
// Thin launcher: the CLI itself is compiled from src/cli/ into dist/.
import { main } from '../dist/cli/main.js';

process.exitCode = main(process.argv.slice(2), process.stdout, process.stderr);
