// Regenerates src/core/fixtures/out/*.geojson from fixtures/in for review on a map:
//   npx tsx scripts/update-validation-fixtures.ts && git diff src/core/fixtures/out
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { validationFixtureOut } from '../src/core/fixtures/validationFixtureOut';

const root = join(import.meta.dirname, '..', 'src', 'core', 'fixtures');
for (const file of readdirSync(join(root, 'in')).filter((f) => f.endsWith('.geojson'))) {
  const fc = JSON.parse(readFileSync(join(root, 'in', file), 'utf8'));
  writeFileSync(join(root, 'out', file), `${JSON.stringify(validationFixtureOut(file, fc), null, 1)}\n`);
  console.log(`wrote fixtures/out/${file}`);
}
