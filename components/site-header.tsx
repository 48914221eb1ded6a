import Link from 'next/link';
import { AccountMenu } from './account-menu';
import { Logo } from './logo';

// Static on purpose: the signed-in part is a small client island, so pages stay cacheable.
export function SiteHeader() {
  return (
    <header className="border-b border-line bg-card/80">
      <div className="mx-auto flex max-w-page flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <Link href="/" className="flex items-center gap-2 text-ink no-underline hover:no-underline">
          <Logo />
          <span className="font-serif text-xl font-semibold">Kettlefork</span>
        </Link>
        <nav aria-label="Main" className="flex flex-1 flex-wrap items-center gap-4 font-sans text-sm">
          <Link href="/search">Find recipes</Link>
          <Link href="/recipes">Newest recipes</Link>
          <Link href="/guides">Guides</Link>
          <Link href="/about">About</Link>
        </nav>
        <AccountMenu />
      </div>
    </header>
  );
}
