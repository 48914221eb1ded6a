import { ResultsSkeleton } from './_components/search-results';

export default function SearchLoading() {
  return (
    <div aria-busy="true">
      <h1 className="text-3xl font-semibold">Find recipes</h1>
      <p className="mt-2 text-muted">Looking through the recipes…</p>
      <div className="mt-8 lg:grid lg:grid-cols-[16rem_minmax(0,1fr)] lg:gap-8">
        <div className="kf-card hidden h-96 animate-pulse lg:block" aria-hidden="true" />
        <ResultsSkeleton />
      </div>
    </div>
  );
}
