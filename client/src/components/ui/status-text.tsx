import type { ReactNode } from 'react';

type Tone = 'neutral' | 'good' | 'caution' | 'bad';

const tones: Record<Tone, string> = {
  neutral: 'text-graphite',
  good: 'text-bonding',
  caution: 'text-caution',
  bad: 'text-antibonding',
};

const marks: Record<Tone, string> = { neutral: '○', good: '●', caution: '◆', bad: '■' };

/** A short state word with a shape as well as a colour, so that colour is never the only cue. */
export function StatusText({ tone, children }: { tone: Tone; children: ReactNode }) {
  return (
    <span className={`inline-flex items-center gap-1.5 whitespace-nowrap ${tones[tone]}`}>
      <span aria-hidden="true" className="text-[0.7em]">
        {marks[tone]}
      </span>
      {children}
    </span>
  );
}
