// The OASIS SARIF 2.1.0 schema as a validator, shared by every test that writes SARIF.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import Ajv from 'ajv-draft-04';

// The OASIS SARIF 2.1.0 schema, copied unchanged (test/standards/oasis-sarif/README.md).
const schemaFile = path.resolve(__dirname, '../standards/oasis-sarif/sarif-schema-2.1.0.json');

/** The OASIS SARIF 2.1.0 schema document. */
export const SARIF_SCHEMA = JSON.parse(readFileSync(schemaFile, 'utf8'));

// RFC 3339 date-time (the schema's "format": "date-time"), checked by pattern and by Date parsing.
const DATE_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?(Z|[+-]\d{2}:\d{2})$/;

/** A validator for SARIF 2.1.0 logs against the OASIS schema; its `errors` say what failed. */
export function sarifValidator() {
  // ajv-draft-04 is CommonJS: under NodeNext the default import is module.exports, whose `default` is the class.
  const ajv = new Ajv.default({ allErrors: true });
  ajv.addFormat('date-time', (value: string) => DATE_TIME.test(value) && !Number.isNaN(Date.parse(value)));
  // An absolute URI parses on its own with the WHATWG URL parser; a reference parses against a base.
  ajv.addFormat('uri', (value: string) => URL.canParse(value));
  ajv.addFormat('uri-reference', (value: string) => URL.canParse(value, 'file:///base/'));
  return ajv.compile(SARIF_SCHEMA);
}
