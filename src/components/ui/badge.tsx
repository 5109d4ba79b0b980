import type { ReactNode } from 'react';

type Tone = 'tide' | 'ember' | 'neutral';

const tones: Record<Tone, string> = {
  tide: 'bg-tide-100 text-tide-900',
  ember: 'bg-ember-100 text-ember-700',
  neutral: 'bg-paper-sunk text-ink-soft',
};

export function Badge({ tone = 'neutral', children }: { tone?: Tone; children: ReactNode }) {
  return (
    <span className={`inline-flex items-center rounded-pill px-2.5 py-0.5 text-caption font-semibold ${tones[tone]}`}>{children}</span>
  );
}
