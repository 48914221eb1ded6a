import ReactMarkdown, { defaultUrlTransform } from 'react-markdown';

const SAFE_URL = /^(https?:|mailto:|\/|#)/i;

/** Links only to the web, mail or our own pages; anything else (javascript:, data:, …) is dropped. */
function safeUrl(url: string): string {
  const cleaned = defaultUrlTransform(url);
  return SAFE_URL.test(cleaned) ? cleaned : '';
}

/**
 * Markdown written by members. Raw HTML is skipped, never rendered; images are shown as their
 * description with a link, so a remote image cannot track readers; links open as untrusted.
 */
export function Markdown({ source, className = '' }: { source: string; className?: string }) {
  return (
    <div className={`kf-prose ${className}`}>
      <ReactMarkdown
        skipHtml
        urlTransform={safeUrl}
        components={{
          img: ({ alt, src }) =>
            typeof src === 'string' && src ? (
              <a href={src} rel="nofollow ugc noopener noreferrer" target="_blank">
                [image: {alt || 'untitled'}]
              </a>
            ) : (
              <span>[image: {alt || 'untitled'}]</span>
            ),
          a: ({ href, children }) =>
            href ? (
              <a href={href} rel="nofollow ugc noopener noreferrer">
                {children}
              </a>
            ) : (
              <span>{children}</span>
            ),
        }}
      >
        {source}
      </ReactMarkdown>
    </div>
  );
}
