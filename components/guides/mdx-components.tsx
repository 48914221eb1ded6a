import Link from 'next/link';
import type { ComponentProps } from 'react';

/** How the guides' Markdown renders: our type scale, anchors that can be linked to, safe links. */
export const guideComponents = {
  h2: (props: ComponentProps<'h2'>) => <h2 {...props} className="mt-10 scroll-mt-6 text-2xl font-semibold" />,
  h3: (props: ComponentProps<'h3'>) => <h3 {...props} className="mt-6 text-lg font-semibold" />,
  p: (props: ComponentProps<'p'>) => <p {...props} className="my-3 leading-relaxed" />,
  ul: (props: ComponentProps<'ul'>) => <ul {...props} className="my-3 list-disc space-y-1 pl-6" />,
  ol: (props: ComponentProps<'ol'>) => <ol {...props} className="my-3 list-decimal space-y-1 pl-6" />,
  // Focusable, so a formula wider than a phone can be scrolled from the keyboard.
  pre: (props: ComponentProps<'pre'>) => (
    <pre
      {...props}
      tabIndex={0}
      className="my-4 overflow-x-auto rounded-md border border-line bg-card p-4 font-mono text-sm leading-relaxed"
    />
  ),
  code: (props: ComponentProps<'code'>) => <code {...props} className="font-mono text-[0.92em]" />,
  a: ({ href = '', children }: ComponentProps<'a'>) =>
    href.startsWith('/') || href.startsWith('#') ? (
      <Link href={href}>{children}</Link>
    ) : (
      <a href={/^https?:/i.test(href) ? href : undefined} rel="noopener noreferrer">
        {children}
      </a>
    ),
};
