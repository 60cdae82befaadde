import { meaningOf } from '@/features/calculators/utils/colour-code';

/*
 * Resistor colour bands as IEC 60062 names them, drawn as swatches. Each swatch has its colour's
 * name and meaning beside it in words: the drawing only repeats what the words say.
 */

// Paint for the swatches only; these are the resistor's colours, not Wardbook's state colours.
const PAINT: Record<string, string> = {
  black: '#1b1b1b',
  brown: '#7a4418',
  red: '#c62828',
  orange: '#ef7d1a',
  yellow: '#f5d316',
  green: '#2e8b3a',
  blue: '#2a5fc0',
  violet: '#7b3fb3',
  grey: '#8d8d8d',
  white: '#ffffff',
  gold: '#c8a046',
  silver: '#c4c7cc',
};

export function ResistorColourBands({ title, bands }: { title: string; bands: readonly string[] }) {
  return (
    <div className="grid gap-2">
      <p className="text-sm font-semibold">{title}</p>
      <div
        aria-hidden="true"
        className="flex h-10 w-56 items-stretch gap-2.5 rounded-full border border-ink/40 px-5"
        style={{ backgroundColor: '#e9d9b4' }}
      >
        {bands.map((colour, index) => (
          <span
            // Bands repeat colours (red-red-red), so the position keeps each apart.
            key={index}
            className={
              index === bands.length - 1
                ? 'ml-auto w-3 border-x border-ink/30'
                : 'w-3 border-x border-ink/30'
            }
            style={{ backgroundColor: PAINT[colour] }}
          />
        ))}
      </div>
      <ol className="grid gap-1 text-sm">
        {bands.map((colour, index) => {
          const meaning = meaningOf(colour, index, bands.length);
          return (
            <li key={index} className="flex items-center gap-2">
              <span
                aria-hidden="true"
                className="size-4 shrink-0 rounded-sm border border-ink/50"
                style={{ backgroundColor: PAINT[colour] }}
              />
              <span>
                {meaning.role}: <span className="font-semibold">{colour}</span>{' '}
                <span className="font-mono">{meaning.value}</span>
              </span>
            </li>
          );
        })}
      </ol>
    </div>
  );
}
