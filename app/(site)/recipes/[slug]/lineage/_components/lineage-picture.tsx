import type { LineageRecipe } from '@/lib/recipes/lineage';

const STEP = 56;
const ROW = 74;
const LEFT = 24;
const TOP = 40;

interface Placed {
  recipe: LineageRecipe;
  row: number;
  startX: number;
}

/** Lays recipes out one lane each, a fork's lane starting just right of the version it came from. */
function layout(recipes: LineageRecipe[]): { placed: Placed[]; versionAt: Map<string, { x: number; y: number }> } {
  const byVersion = new Map<string, LineageRecipe>();
  for (const r of recipes) for (const v of r.versions) byVersion.set(v.id, r);
  const children = new Map<string, LineageRecipe[]>();
  const roots: LineageRecipe[] = [];
  for (const r of recipes) {
    const parent = r.forkedFromVersionId ? byVersion.get(r.forkedFromVersionId) : undefined;
    if (parent) children.set(parent.id, [...(children.get(parent.id) ?? []), r]);
    else roots.push(r);
  }
  const placed: Placed[] = [];
  const versionAt = new Map<string, { x: number; y: number }>();
  const visit = (r: LineageRecipe, startX: number) => {
    const row = placed.length;
    placed.push({ recipe: r, row, startX });
    r.versions.forEach((v, i) => versionAt.set(v.id, { x: startX + i * STEP, y: TOP + row * ROW }));
    for (const child of children.get(r.id) ?? []) {
      const from = versionAt.get(child.forkedFromVersionId!);
      visit(child, (from?.x ?? startX) + STEP);
    }
  };
  for (const root of roots) visit(root, LEFT);
  return { placed, versionAt };
}

/** The family of forks as a picture: lanes of versions, with a curve from each fork's source version. */
export function LineagePicture({ recipes, currentId }: { recipes: LineageRecipe[]; currentId: string }) {
  const { placed, versionAt } = layout(recipes);
  const width = Math.max(...[...versionAt.values()].map((p) => p.x), LEFT) + 260;
  const height = TOP + placed.length * ROW;
  return (
    <svg
      viewBox={`0 0 ${width} ${height}`}
      width={width}
      height={height}
      role="group"
      aria-labelledby="lineage-title"
      className="max-w-none font-sans"
    >
      <title id="lineage-title">Forks and their versions</title>
      {placed.map(({ recipe }) =>
        recipe.forkedFromVersionId && versionAt.has(recipe.forkedFromVersionId) && recipe.versions[0] ? (
          <path
            key={`fork-${recipe.id}`}
            d={(() => {
              const a = versionAt.get(recipe.forkedFromVersionId)!;
              const b = versionAt.get(recipe.versions[0].id)!;
              return `M ${a.x} ${a.y} C ${a.x} ${(a.y + b.y) / 2}, ${b.x - STEP / 2} ${b.y}, ${b.x} ${b.y}`;
            })()}
            fill="none"
            stroke="rgb(var(--kf-bine))"
            strokeWidth="2.5"
            strokeDasharray={recipe.hidden ? '4 4' : undefined}
          />
        ) : null,
      )}
      {placed.map(({ recipe, row, startX }) => {
        const y = TOP + row * ROW;
        const last = versionAt.get(recipe.versions[recipe.versions.length - 1]?.id ?? '');
        const current = recipe.id === currentId;
        const ink = recipe.hidden ? 'rgb(var(--kf-muted))' : 'rgb(var(--kf-copper))';
        return (
          <g key={recipe.id}>
            {last && last.x > startX && <line x1={startX} y1={y} x2={last.x} y2={y} stroke={ink} strokeWidth="3" />}
            {recipe.versions.map((v) => {
              const p = versionAt.get(v.id)!;
              const dot = (
                <circle
                  cx={p.x}
                  cy={y}
                  r={current ? 11 : 9}
                  fill={current ? ink : 'rgb(var(--kf-card))'}
                  stroke={ink}
                  strokeWidth="3"
                />
              );
              return recipe.slug ? (
                <a
                  key={v.id}
                  href={`/recipes/${recipe.slug}/v/${v.number}`}
                  aria-label={`${recipe.title}, version ${v.number}${v.message ? `: ${v.message}` : ''}`}
                >
                  <title>{`${recipe.title}, version ${v.number}${v.message ? ` — ${v.message}` : ''}`}</title>
                  {dot}
                  <text
                    x={p.x}
                    y={y + 4}
                    textAnchor="middle"
                    fontSize="10"
                    fill={current ? 'rgb(var(--kf-paper))' : 'rgb(var(--kf-ink))'}
                  >
                    {v.number}
                  </text>
                </a>
              ) : (
                <g key={v.id}>{dot}</g>
              );
            })}
            <text
              x={(last?.x ?? startX) + 20}
              y={y + 5}
              fontSize="13"
              fill="rgb(var(--kf-ink))"
              fontWeight={current ? 700 : 400}
            >
              {recipe.hidden && !recipe.slug ? 'Hidden by moderators' : recipe.title}
              {recipe.ownerName && <tspan fill="rgb(var(--kf-muted))"> · {recipe.ownerName}</tspan>}
            </text>
          </g>
        );
      })}
    </svg>
  );
}
