import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { SCHEMAS } from '../src/tools/schemaRegistry.js';
import { jsonSchemaText } from '../src/tools/writeSchemas.js';

describe('JSON Schemas in shared/', () => {
  it('has one schema per YAML format users write (model, analysis, detector profile, scan)', () => {
    expect(SCHEMAS.map((s) => s.file).sort()).toEqual(['analysis.schema.json', 'detector.schema.json', 'model.schema.json', 'scan.schema.json']);
  });
  for (const entry of SCHEMAS) {
    it(`shared/${entry.file} is up to date with its zod definition (run npm run schemas)`, async () => {
      const committed = readFileSync(new URL(`../shared/${entry.file}`, import.meta.url), 'utf8');
      expect(committed).toBe(await jsonSchemaText(entry));
    });
  }
});
