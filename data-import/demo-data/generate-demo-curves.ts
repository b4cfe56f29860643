// Writes the demo curve tables (invented data) next to this script:
// `npm run generate:demo-curves`. The output is the same on every run.
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { demoCurveTables } from './demo-curve-tables';

for (const table of demoCurveTables()) {
  const path = fileURLToPath(new URL(`./${table.fileName}`, import.meta.url));
  writeFileSync(path, table.text);
  console.log(`wrote ${table.fileName} (${table.text.split('\n').length - 1} lines)`);
}
