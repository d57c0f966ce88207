/** A preformatted, horizontally scrollable block of code or shell text with a caption. */
export function CodeBlock({ caption, children }: { caption: string; children: string }) {
  return (
    <figure className="space-y-1">
      <figcaption className="text-xs font-medium uppercase tracking-wide text-ink-muted">{caption}</figcaption>
      <pre className="max-h-80 overflow-auto rounded-md bg-ink px-4 py-3 text-xs leading-relaxed text-paper">
        <code>{children}</code>
      </pre>
    </figure>
  );
}
