/**
 * Writes the JSON Schemas of every YAML format to shared/ (`npm run schemas`),
 * generated from the zod definitions so the two never drift.
 */
import { join } from 'node:path';
import { z } from 'zod';
import { writeFileAtomic } from '../io/atomicWrite.js';
import { SCHEMAS, type SchemaEntry } from './schemaRegistry.js';

/** The JSON Schema text of one format, as committed under shared/. */
export async function jsonSchemaText(entry: SchemaEntry): Promise<string> {
  const schema = await entry.load();
  const json = z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as Record<string, unknown>;
  const withTitle = { $schema: json['$schema'], title: entry.title, description: entry.description, ...json };
  return `${JSON.stringify(withTitle, null, 2)}\n`;
}

export async function writeAllSchemas(folder: string): Promise<string[]> {
  const written: string[] = [];
  for (const entry of SCHEMAS) {
    const file = join(folder, entry.file);
    writeFileAtomic(file, await jsonSchemaText(entry));
    written.push(file);
  }
  return written;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const folder = process.argv[2] ?? 'shared';
  for (const file of await writeAllSchemas(folder)) process.stdout.write(`wrote ${file}\n`);
}
