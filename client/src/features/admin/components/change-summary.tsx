import { compactChange, type ChangeLine } from '../lib/compact-change';

const MAX_LINES = 5;

function Line({ line }: { line: ChangeLine }) {
  const key = line.key ? <span className="text-graphite">{line.key}: </span> : null;
  if (line.kind === 'added') {
    return (
      <li>
        <span className="text-bonding" aria-hidden="true">+ </span>
        <span className="sr-only">added </span>
        {key}
        <span className="text-bonding">{line.after}</span>
      </li>
    );
  }
  if (line.kind === 'removed') {
    return (
      <li>
        <span className="text-antibonding" aria-hidden="true">− </span>
        <span className="sr-only">removed </span>
        {key}
        <del className="text-antibonding">{line.before}</del>
      </li>
    );
  }
  return (
    <li>
      <span className="text-graphite" aria-hidden="true">~ </span>
      {key}
      <span className="sr-only">changed from </span>
      <del className="text-antibonding no-underline">{line.before}</del>
      <span className="text-graphite" aria-hidden="true"> → </span>
      <span className="sr-only"> to </span>
      <ins className="text-bonding no-underline">{line.after}</ins>
    </li>
  );
}

/** An audit entry's before/after as a few short lines, the full records behind a disclosure. */
export function ChangeSummary({ before, after }: { before: unknown; after: unknown }) {
  const lines = compactChange(before, after);
  if (lines.length === 0) {
    return <span className="text-graphite">No field changes</span>;
  }
  const shown = lines.slice(0, MAX_LINES);
  const hidden = lines.length - shown.length;
  return (
    <div className="text-[0.8rem] leading-5">
      <ul className="num [overflow-wrap:anywhere]" data-testid="change-lines">
        {shown.map((line) => (
          <Line key={`${line.kind}:${line.key}`} line={line} />
        ))}
      </ul>
      <details className="mt-0.5">
        <summary className="cursor-pointer text-reference">
          {hidden > 0 ? `${hidden} more field${hidden === 1 ? '' : 's'}; full records` : 'Full records'}
        </summary>
        <div className="mt-1 grid gap-2 sm:grid-cols-2">
          <figure>
            <figcaption className="text-graphite">Before</figcaption>
            <pre className="num max-h-64 overflow-auto rounded-[2px] bg-wash p-2 text-[0.75rem]">
              {before === null || before === undefined ? '—' : JSON.stringify(before, null, 2)}
            </pre>
          </figure>
          <figure>
            <figcaption className="text-graphite">After</figcaption>
            <pre className="num max-h-64 overflow-auto rounded-[2px] bg-wash p-2 text-[0.75rem]">
              {after === null || after === undefined ? '—' : JSON.stringify(after, null, 2)}
            </pre>
          </figure>
        </div>
      </details>
    </div>
  );
}
