import Markdown from 'react-markdown';
import type { IssueMap } from '../lib/form-issues';
import { FieldShell, inputClasses } from './fields';

/** Markdown rendered safely: raw HTML is dropped (skipHtml) and react-markdown's URL filter stays on. */
export function SafeMarkdown({ text }: { text: string }) {
  return (
    <div className="markdown grid gap-2 text-ink [&_a]:text-reference [&_a]:underline [&_code]:num [&_code]:rounded-[2px] [&_code]:bg-wash [&_code]:px-1 [&_h1]:font-serif [&_h1]:text-xl [&_h2]:font-serif [&_h2]:text-lg [&_ol]:list-decimal [&_ol]:pl-6 [&_ul]:list-disc [&_ul]:pl-6">
      <Markdown skipHtml>{text}</Markdown>
    </div>
  );
}

export function MarkdownField({ value, onChange, issues }: { value: string; onChange: (v: string) => void; issues: IssueMap }) {
  return (
    <div className="grid gap-3 lg:grid-cols-2">
      <FieldShell path="instructionsMarkdown" label="Instructions (Markdown)" issues={issues} hint="Headings, lists, **bold**, `code` and links; HTML is not shown.">
        {(a11y) => <textarea {...a11y} rows={9} value={value} onChange={(e) => onChange(e.target.value)} className={`${inputClasses} h-auto py-2 font-mono text-[0.85rem]`} />}
      </FieldShell>
      <section aria-label="Instructions as students see them" className="min-w-0">
        <p className="mb-1 text-sm font-semibold text-ink">As students see them</p>
        <div className="min-h-[10rem] rounded-[3px] border border-rule bg-white px-3 py-2" data-testid="instructions-preview">
          {value.trim() ? <SafeMarkdown text={value} /> : <p className="text-graphite">Nothing written yet.</p>}
        </div>
      </section>
    </div>
  );
}
