import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { planFixtureOut } from '../src/core/fixtures/planFixtureOut';

// Rewrites src/core/fixtures/plan/out from plan/in; look at the diff on a map before keeping it.
const dir = join(dirname(fileURLToPath(import.meta.url)), '..', 'src', 'core', 'fixtures', 'plan');
for (const name of readdirSync(join(dir, 'in')).filter((n) => n.endsWith('.geojson'))) {
  writeFileSync(join(dir, 'out', name), planFixtureOut(readFileSync(join(dir, 'in', name), 'utf8')));
  console.log(`wrote fixtures/plan/out/${name}`);
}
