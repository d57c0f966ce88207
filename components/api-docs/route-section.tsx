import type { RouteDoc } from "@/lib/api/routes";
import { curlCommand } from "@/lib/api/present";
import { CodeBlock } from "./code-block";
import { ExampleRunner } from "./example-runner";

/** One route: what it does, its units and limits, the example as curl, and a button that runs it. */
export function RouteSection({ route, baseUrl }: { route: RouteDoc; baseUrl: string }) {
  return (
    <section className="card space-y-4" id={route.operationId} aria-labelledby={`${route.operationId}-title`}>
      <header className="space-y-1">
        <p className="font-mono text-sm">
          <span className="mr-2 rounded bg-tide-light px-1.5 py-0.5 text-xs font-semibold uppercase text-tide">{route.method}</span>
          {route.path}
        </p>
        <h2 id={`${route.operationId}-title`}>{route.summary}</h2>
      </header>
      <div className="space-y-2 text-sm leading-relaxed text-ink-soft">
        {route.description.map((p) => <p key={p}>{p}</p>)}
      </div>
      <div className="space-y-2 border-t border-paper-line pt-4">
        <h3 className="font-medium">Example: {route.example.summary}</h3>
        <p className="text-sm text-ink-soft">{route.example.description}</p>
        <CodeBlock caption="curl">{curlCommand(`${baseUrl}${route.path}`, route.example.body)}</CodeBlock>
        <ExampleRunner path={route.path} body={route.example.body} operationId={route.operationId} />
      </div>
      {route.binary && (
        <div className="space-y-2 border-t border-paper-line pt-4" data-testid={`${route.operationId}-binary`}>
          <h3 className="font-medium">Compact answer: {route.binary.mediaType}</h3>
          <p className="text-sm leading-relaxed text-ink-soft">{route.binary.description}</p>
          <CodeBlock caption="Python (pyarrow + pandas)">{route.binary.python(`${baseUrl}${route.path}`)}</CodeBlock>
        </div>
      )}
    </section>
  );
}
