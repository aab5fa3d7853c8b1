// Independent reader check (Arrow JS, not linewright's own code): prints every (p, T, wavenumber, sigma) row of a
// linewright Arrow table as "p T nu sigma" with 17 significant digits, then checks the table's metadata key
// linewright.sigma_sha256 against SHA-256 of sigma's values as stored (little-endian, order [p][T][nu]).
// Usage: node read-table-arrow.mjs TABLE.arrow   (needs the npm package apache-arrow on NODE_PATH or beside it)
import { readFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { createRequire } from 'node:module';

const require = createRequire(process.env.ARROW_MODULE_DIR ? process.env.ARROW_MODULE_DIR + '/' : import.meta.url);
const arrow = require('apache-arrow');

const table = arrow.tableFromIPC(readFileSync(process.argv[2]));
const meta = table.schema.metadata;
const sigmaField = table.schema.fields.find(f => f.name === 'cross_section_cm2_per_molecule');
if (!sigmaField) throw new Error('no column cross_section_cm2_per_molecule');
const single = sigmaField.type.precision === arrow.Precision.SINGLE;
const hash = createHash('sha256');
const lines = [];
for (const batch of table.batches) {
  const p = batch.getChild('pressure_bar').toArray();
  const t = batch.getChild('temperature_K').toArray();
  const nu = batch.getChild('wavenumber_cm1').toArray();
  const s = batch.getChild('cross_section_cm2_per_molecule').toArray();
  const buf = Buffer.alloc(s.length * (single ? 4 : 8));
  for (let i = 0; i < s.length; i++) {
    if (single) buf.writeFloatLE(s[i], 4 * i); else buf.writeDoubleLE(s[i], 8 * i);
    lines.push(`${p[i].toPrecision(17)} ${t[i].toPrecision(17)} ${nu[i].toPrecision(17)} ${s[i].toPrecision(17)}`);
  }
  hash.update(buf);
}
process.stdout.write(lines.join('\n') + '\n');
const expected = meta.get('linewright.sigma_sha256');
const actual = hash.digest('hex');
if (expected !== actual) {
  console.error(`sigma_sha256 mismatch: metadata ${expected}, values ${actual}`);
  process.exit(1);
}
console.error(`arrow: ${table.batches.length} batches, ${table.numRows} rows, sigma_sha256 ok`);
