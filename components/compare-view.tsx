import Link from 'next/link';
import type {
  ChangeStatus,
  DocumentComparison,
  ItemComparison,
  SectionComparison,
  StatAttribution,
  StatDelta,
} from '@/lib/recipes/compare';
import { SECTION_TITLE as FIELD_SECTION_TITLE } from '@/lib/recipes/fields';

const SECTION_TITLE: Record<SectionComparison['section'], string> = FIELD_SECTION_TITLE;

const STATUS_STYLE: Record<ChangeStatus, string> = {
  added: 'border-l-4 border-bine bg-bine/10',
  removed: 'border-l-4 border-danger bg-danger/5',
  changed: 'border-l-4 border-copper bg-copper/5',
  same: 'border-l-4 border-transparent',
};

const STATUS_WORD: Record<ChangeStatus, string> = {
  added: 'added',
  removed: 'removed',
  changed: 'changed',
  same: 'same',
};

function Item({ item }: { item: ItemComparison }) {
  return (
    <li className={`rounded-sm px-3 py-2 ${STATUS_STYLE[item.status]}`}>
      <p className="font-semibold">
        {item.kind === 'swap' || item.kind === 'moved' ? item.summary : item.label}{' '}
        <span className="ml-1 font-sans text-xs font-normal uppercase tracking-wide text-muted">
          {STATUS_WORD[item.status]}
        </span>
      </p>
      {item.status === 'changed' && (
        <ul className="kf-data mt-1 text-sm">
          {item.changes.map((c) => (
            <li key={c.field}>
              {c.label}: <del className="text-danger">{c.before}</del> →{' '}
              <ins className="text-bine no-underline">{c.after}</ins>
              {c.delta && <span className="ml-1 text-muted">({c.delta})</span>}
            </li>
          ))}
        </ul>
      )}
      {(item.status === 'added' || item.status === 'removed') && (
        <p className="kf-data mt-1 text-sm text-muted">{item.details}</p>
      )}
    </li>
  );
}

function StatRow({ row }: { row: StatDelta }) {
  return (
    <tr className={`border-b border-line/50 ${row.moved ? 'font-semibold' : ''}`}>
      <th scope="row" className="py-1.5 pr-3 text-left font-normal">
        {row.label}
      </th>
      <td className="py-1.5 pr-3">{row.beforeText}</td>
      <td className="py-1.5 pr-3">{row.afterText}</td>
      <td className={`py-1.5 ${row.moved ? 'text-copper-strong' : 'text-muted'}`}>{row.deltaText}</td>
    </tr>
  );
}

/** Why the numbers moved: each changed number with the changes that moved it. */
function AttributionList({ attribution, effects }: { attribution: StatAttribution[]; effects?: string[] }) {
  if (!attribution.length) return <p className="mt-3 font-sans text-sm text-muted">No number changed.</p>;
  return (
    <div className="mt-3">
      <ul className="mt-1 list-disc space-y-1 pl-5 font-sans text-sm">
        {attribution.map((a, i) => (
          <li key={a.stat}>{effects?.[i] ?? a.sentence}</li>
        ))}
      </ul>
    </div>
  );
}

export interface CompareSide {
  title: string;
  slug: string;
  number: number;
  ownerName: string;
}

/** Two versions side by side: what changed in the ingredients, every number with its delta, and the notes. */
export function CompareView({
  a,
  b,
  comparison,
  showUnchanged,
  effects,
}: {
  a: CompareSide;
  b: CompareSide;
  comparison: DocumentComparison;
  showUnchanged: boolean;
  /** One sentence per attribution, in its order, when the page words them itself (a proposal's "Accepting this changes …"). */
  effects?: string[];
}) {
  const sides = [a, b];
  return (
    <div className="space-y-10">
      <div className="grid gap-3 sm:grid-cols-2">
        {sides.map((s, i) => (
          <div key={i} className="kf-card">
            <p className="font-sans text-xs uppercase tracking-wide text-muted">{i === 0 ? 'From' : 'To'}</p>
            <p className="text-lg font-semibold">
              <Link href={`/recipes/${s.slug}/v/${s.number}`}>
                {s.title}, version {s.number}
              </Link>
            </p>
            <p className="font-sans text-sm text-muted">by {s.ownerName}</p>
          </div>
        ))}
      </div>
      <section aria-labelledby="numbers-heading">
        <h2 id="numbers-heading" className="text-xl font-semibold">
          Numbers
        </h2>
        <div className="mt-3 overflow-x-auto">
          <table className="kf-data w-full max-w-2xl border-collapse text-sm">
            <thead>
              <tr className="border-b border-line text-left text-muted">
                <th scope="col" className="py-1.5 pr-3">
                  Number
                </th>
                <th scope="col" className="py-1.5 pr-3">
                  Version {a.number}
                </th>
                <th scope="col" className="py-1.5 pr-3">
                  Version {b.number}
                </th>
                <th scope="col" className="py-1.5">
                  Change
                </th>
              </tr>
            </thead>
            <tbody>
              {comparison.stats.map((row) => (
                <StatRow key={row.stat} row={row} />
              ))}
            </tbody>
          </table>
        </div>
        <h3 className="mt-6 text-lg font-semibold">Why the numbers moved</h3>
        {comparison.identical ? (
          <p className="mt-3 font-sans text-sm text-muted">The two versions are identical.</p>
        ) : (
          <AttributionList attribution={comparison.attribution} effects={effects} />
        )}
      </section>
      <section aria-labelledby="ingredients-heading">
        <h2 id="ingredients-heading" className="text-xl font-semibold">
          Ingredients and schedule{' '}
          <span className="font-sans text-sm font-normal text-muted">
            ({comparison.changeCount} {comparison.changeCount === 1 ? 'difference' : 'differences'})
          </span>
        </h2>
        <p className="mt-1 font-sans text-sm">
          <span className="text-muted">
            {showUnchanged ? 'Showing every ingredient.' : 'Showing differences only.'}
          </span>
        </p>
        <div className="mt-4 grid gap-6 md:grid-cols-2">
          {comparison.sections.map((section) => {
            const items = showUnchanged ? section.items : section.items.filter((i) => i.status !== 'same');
            if (!items.length) return null;
            return (
              <div key={section.section}>
                <h3 className="font-semibold">{SECTION_TITLE[section.section]}</h3>
                <ul className="mt-2 space-y-2 font-sans text-sm">
                  {items.map((item, i) => (
                    <Item key={i} item={item} />
                  ))}
                </ul>
              </div>
            );
          })}
          {comparison.changeCount === 0 && (
            <p className="font-sans text-sm text-muted">The ingredients and schedules are the same.</p>
          )}
        </div>
      </section>
      <section aria-labelledby="notes-diff-heading">
        <h2 id="notes-diff-heading" className="text-xl font-semibold">
          Notes
        </h2>
        <p className="mt-1 font-sans text-xs text-muted">
          <ins className="bg-bine/15 no-underline">Added words</ins> and{' '}
          <del className="bg-danger/10">removed words</del> are marked.
        </p>
        <p className="kf-card mt-3 whitespace-pre-wrap leading-relaxed">
          {comparison.notes.map((part, i) =>
            part.added ? (
              <ins key={i} className="bg-bine/15 no-underline">
                {part.value}
              </ins>
            ) : part.removed ? (
              <del key={i} className="bg-danger/10">
                {part.value}
              </del>
            ) : (
              <span key={i}>{part.value}</span>
            ),
          )}
        </p>
      </section>
    </div>
  );
}
