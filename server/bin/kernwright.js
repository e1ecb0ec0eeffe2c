#!/usr/bin/env node
'use strict';
// Thin launcher: the bundled program is built by `npm install` (the root `prepare` step).
require('../dist/cli.js');
