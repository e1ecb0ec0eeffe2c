/**
 * Validation against the SARIF 2.1.0 JSON schema: the schema file sarif-2.1.0-rtm.5.json shipped by the npm package
 * @microsoft/jest-sarif (from Microsoft's sarif-js-sdk), checked with Ajv for draft-04 schemas and ajv-formats (uri,
 * uri-reference, date-time).
 */
import { createRequire } from 'node:module';
import * as fs from 'node:fs';
import { expect } from 'vitest';
import Ajv from 'ajv-draft-04';
import addFormats from 'ajv-formats';

const require = createRequire(import.meta.url);
const schemaPath = require.resolve('@microsoft/jest-sarif/lib/schemas/sarif-2.1.0-rtm.5.json');
const schema = JSON.parse(fs.readFileSync(schemaPath, 'utf8'));
// unicodeRegExp off: one pattern of the schema (a language tag) is not valid in the regular expressions' unicode mode.
const ajv = new Ajv({ allErrors: true, strict: false, unicodeRegExp: false });
addFormats(ajv);

export const validateSarif = ajv.compile(schema);

export function expectValidSarif(log: unknown): void {
  const ok = validateSarif(JSON.parse(JSON.stringify(log)));
  expect(ok ? [] : validateSarif.errors).toEqual([]);
}
