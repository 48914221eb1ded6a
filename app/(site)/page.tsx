import Link from 'next/link';

const features = [
  {
    title: 'Every save is a version',
    body: 'Change one thing — the yeast, the mash temperature — and save. Each version keeps its own numbers, so you can see what the change did.',
  },
  {
    title: 'Fork and compare',
    body: 'Brew someone else’s recipe your way. Kettlefork keeps the line back to where it came from and shows both side by side.',
  },
  {
    title: 'Numbers you can check',
    body: 'Gravity, bitterness, colour, water and carbonation are computed from published formulas, and every guide names its source.',
  },
  {
    title: 'Brew days, not just plans',
    body: 'Log what you measured on the day and in the fermenter, next to what the recipe predicted.',
  },
];

export default function HomePage() {
  return (
    <div>
      <section className="grid gap-8 md:grid-cols-[3fr_2fr] md:items-center">
        <div>
          <h1 className="text-4xl font-semibold leading-tight md:text-5xl">
            Homebrew recipes that remember every change.
          </h1>
          <p className="mt-4 text-lg text-muted">
            Kettlefork is where homebrewers publish recipes as versioned records, fork each other’s, log their brew days
            and find recipes by style, hop, malt or yeast.
          </p>
          <div className="mt-6 flex flex-wrap gap-3">
            <Link href="/sign-up" className="kf-btn">
              Start your first recipe
            </Link>
            <Link href="/about" className="kf-btn-quiet">
              How Kettlefork works
            </Link>
          </div>
        </div>
        <figure className="kf-card font-sans text-sm" aria-label="An example recipe history">
          <figcaption className="font-serif text-lg font-semibold">Harbour Light Pale Ale</figcaption>
          <ol className="mt-3 space-y-2">
            <li className="flex justify-between gap-3 border-l-4 border-copper pl-3">
              <span>v3 · mashed 2 °C hotter for more body</span>
              <span className="kf-data text-muted">FG 1.013</span>
            </li>
            <li className="flex justify-between gap-3 border-l-4 border-line pl-3">
              <span>v2 · swapped to a kveik strain</span>
              <span className="kf-data text-muted">FG 1.011</span>
            </li>
            <li className="flex justify-between gap-3 border-l-4 border-line pl-3">
              <span>v1 · first brew</span>
              <span className="kf-data text-muted">FG 1.010</span>
            </li>
          </ol>
        </figure>
      </section>
      <section aria-labelledby="why" className="mt-14">
        <h2 id="why" className="text-2xl font-semibold">
          Why brewers use it
        </h2>
        <ul className="mt-4 grid gap-4 sm:grid-cols-2">
          {features.map((f) => (
            <li key={f.title} className="kf-card">
              <h3 className="text-lg font-semibold">{f.title}</h3>
              <p className="mt-2 text-muted">{f.body}</p>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
