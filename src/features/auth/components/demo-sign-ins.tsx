/**
 * The published demo accounts of our invented scenario (the Larkspur Street Makerspace tube-logic
 * group and the Room 14 Digital Electronics class). They exist only when the demo is seeded.
 */
const DEMO_ACCOUNTS = [
  { email: 'mara@larkspur.example', who: 'Mara Quinn, Larkspur Street Makerspace (site admin)' },
  { email: 'theo@larkspur.example', who: 'Theo Vance, tube-logic builder' },
  { email: 'ines@larkspur.example', who: 'Ines Okafor, tube-logic builder' },
  { email: 'calder@room14.example', who: 'Ruth Calder, Room 14 teacher' },
  { email: 'sam@room14.example', who: 'Sam Ortiz, Room 14 student' },
  { email: 'priya@room14.example', who: 'Priya Nair, Room 14 student' },
] as const;

export const DEMO_PASSWORD = 'gatefold-demo';

export function DemoSignIns({ onPick }: { onPick: (email: string) => void }) {
  return (
    <details open className="rounded-lg border border-mat-700 bg-mat-900/80 px-4 py-3 text-sm" data-testid="demo-sign-ins">
      <summary className="cursor-pointer select-none font-medium text-slate-300">Demo sign-ins</summary>
      <p className="mt-2 text-slate-400">
        On a server started with the demo data, these accounts share the password{' '}
        <code className="font-mono text-amber-300">{DEMO_PASSWORD}</code>. Click one to fill it in.
      </p>
      <ul className="mt-2 flex flex-col gap-1">
        {DEMO_ACCOUNTS.map((a) => (
          <li key={a.email}>
            <button type="button" onClick={() => onPick(a.email)} className="text-left hover:text-amber-300">
              <span className="font-mono text-slate-200">{a.email}</span>
              <span className="text-slate-500"> — {a.who}</span>
            </button>
          </li>
        ))}
      </ul>
    </details>
  );
}
