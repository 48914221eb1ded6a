import Link from 'next/link';
import { SiteChrome } from '@/components/site-chrome';

export default function NotFound() {
  return (
    <SiteChrome>
      <div className="mx-auto max-w-md py-10 text-center">
        <p className="kf-data text-sm text-muted">404</p>
        <h1 className="mt-2 text-3xl font-semibold">Nothing on this shelf</h1>
        <p className="mt-3 text-muted">The page you asked for does not exist, or you do not have access to it.</p>
        <p className="mt-6">
          <Link href="/" className="kf-btn">
            Back to the start
          </Link>
        </p>
      </div>
    </SiteChrome>
  );
}
