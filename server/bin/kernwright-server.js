#!/usr/bin/env node
'use strict';
// Language server over stdio (`--stdio`) or IPC (`--node-ipc`). Built by the root `prepare` step.
require('../dist/server.js');
