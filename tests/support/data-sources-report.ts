/**
 * Prints the parts of docs/data-sources.md that follow from the data: the
 * counts by status, the bibliography and the table of recalled values.
 *   node --import tsx tests/support/data-sources-report.ts
 */
import { SOURCES } from '../../shared/engine/data/sources';
import { countByStatus, sourcedValues } from '../../shared/engine/data/provenance';
import type { SourcedValueRef } from '../../shared/engine/data/provenance';

const solvents = sourcedValues('solvents');
const aqueous = sourcedValues('aqueous');
const c = countByStatus(solvents);
const a = countByStatus(aqueous);
console.log(
  `Counts (41 solvents, ${solvents.length} sourced values): ${c.confirmed} confirmed, ${c.secondary} secondary, ${c['unverified-memory']} unverified-memory, ${c.estimated} estimated/derived, ${c['common-practice']} common-practice, ${c['not-confirmed']} not-confirmed. Aqueous media (${AQUEOUS_COUNT()} solutes, ${aqueous.length} sourced values): ${a.secondary} secondary, ${a['unverified-memory']} unverified-memory, ${a.estimated} derived.`,
);
function AQUEOUS_COUNT() {
  return new Set(aqueous.map((v) => v.record)).size;
}
console.log('\n## Bibliography\n');
for (const [id, e] of Object.entries(SOURCES)) {
  const entry = e as { citation: string; via?: string; url?: string };
  console.log(
    `- **${id}** — ${entry.citation}.${entry.via ? ` Read via ${entry.via}` : ''}${entry.url ? ` <${entry.url}>` : ''}`,
  );
}
const row = (v: SourcedValueRef) =>
  `| ${v.record} | ${v.field} | ${JSON.stringify(v.value)} | ${v.source.ref} | ${v.source.note ?? ''} |`;
console.log('\n| record | field | value | source id | note |\n| --- | --- | --- | --- | --- |');
for (const v of [...solvents, ...aqueous].filter((x) => x.source.status === 'unverified-memory'))
  console.log(row(v));
