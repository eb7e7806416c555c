import Markdown, { defaultUrlTransform, type Components } from 'react-markdown';
import remarkGfm from 'remark-gfm';

export type MarkdownDescriptionProps = { markdown: string };

/** Web and mail links only; everything else (javascript:, data:, vbscript:) becomes an empty, inert link. */
export function safeUrl(url: string): string {
  const cleaned = defaultUrlTransform(url);
  return /^(https?:|mailto:|#|\/(?!\/))/i.test(cleaned) ? cleaned : '';
}

// The page owns h1 and h2; an author's headings start one level below its sections.
const COMPONENTS: Components = {
  h1: ({ children }) => <h3>{children}</h3>,
  h2: ({ children }) => <h3>{children}</h3>,
  h3: ({ children }) => <h4>{children}</h4>,
  h4: ({ children }) => <h5>{children}</h5>,
  h5: ({ children }) => <h6>{children}</h6>,
  a: ({ href, children }) =>
    href ? <a href={href} rel="nofollow ugc noopener noreferrer">{children}</a> : <span>{children}</span>,
  // No third-party images load from a landing page: an image becomes a plain link to it.
  img: ({ src, alt }) =>
    typeof src === 'string' && src ? <a href={src} rel="nofollow ugc noopener noreferrer">{`Image: ${alt || src}`}</a> : <span>{alt}</span>,
};

/** An author's Markdown (GitHub flavour) as text and elements only: raw HTML is dropped, never rendered. */
export function MarkdownDescription({ markdown }: MarkdownDescriptionProps) {
  return (
    <div className="prose prose-slate max-w-none prose-a:text-copper-700 prose-headings:font-semibold prose-pre:bg-slate-800 prose-table:block prose-table:overflow-x-auto">
      <Markdown remarkPlugins={[remarkGfm]} skipHtml urlTransform={safeUrl} components={COMPONENTS}>
        {markdown}
      </Markdown>
    </div>
  );
}
