import { useId } from 'react';

/**
 * Broodcast's cautions, in its own words (DESIGN.md §5). Shown on the Ladder and, later, on every
 * District file. Keep the wording here only, so every screen says the same thing.
 */
export const CAUTIONS = [
  'Broodcast estimates how favourable conditions are for mosquitoes and for transmission, from station weather, reported cases and larval surveys. A tier is an estimate, not a measurement.',
  'It does not diagnose anyone, it does not count mosquitoes, and it cannot say for certain how many cases will come.',
  'Decisions on warnings and on the response rest with the national health authority and follow its guidelines.',
  'Insecticides, larvicides and fogging are work for trained staff only, under local regulations and as the product label directs.',
  'Questions about a patient’s illness or treatment go to a licensed clinician.',
] as const;

export function CautionsPanel({ className }: { className?: string }) {
  const headingId = useId();
  return (
    <aside aria-labelledby={headingId} className={`cautions ${className ?? ''}`}>
      <h2 id={headingId} className="text-base font-bold text-accent-900">
        Before you act on these estimates
      </h2>
      <ul className="mt-2 list-disc space-y-1.5 pl-5 text-sm leading-relaxed">
        {CAUTIONS.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
    </aside>
  );
}
