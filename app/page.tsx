import Link from 'next/link';
import { Wordmark } from '@/components/shell/Wordmark';
import { CautionNotice } from '@/components/shell/CautionNotice';

const STEPS = [
  {
    title: 'Pick a conductor and a current',
    text: 'Bars or cable cores from the team catalogue, each value with the table or datasheet it came from.',
  },
  {
    title: 'Solve the heat balance',
    text: 'A finite-volume solution through the bar or the cable layers: I²R loss that grows with temperature, conduction, convection and radiation to the surroundings.',
  },
  {
    title: 'Read the hot spot and the ampacity',
    text: 'Against the rated limits, with short-circuit, voltage-drop and loss-cost checks, and candidates side by side.',
  },
  {
    title: 'Get it reviewed and signed',
    text: 'Every assumption becomes a flag a licensed engineer accepts or rejects. Share the sheet as a link, a PDF or an e-mail.',
  },
];

export default function LandingPage() {
  return (
    <div className="min-h-screen bg-paper">
      <header className="bg-ink-900">
        <div className="mx-auto flex h-14 max-w-5xl items-center justify-between px-6">
          <Wordmark />
          <Link href="/sign-in" className="btn-primary">
            Sign in
          </Link>
        </div>
      </header>
      <main className="mx-auto max-w-5xl px-6 py-14">
        <h1 className="text-display text-ink-900">Size bus bars and cables by their heating — and prove it.</h1>
        <p className="mt-4 max-w-3xl text-lead text-ink-700">
          Ampwarden is the team workspace for electrical designers who must choose bars and cables that carry the design
          current without exceeding the temperature their insulation, joints and neighbours tolerate, at the lowest material
          and energy-loss cost — and document that check so a licensed engineer can review and sign it.
        </p>
        <ol className="mt-10 grid gap-4 sm:grid-cols-2">
          {STEPS.map((step, index) => (
            <li key={step.title} className="panel p-5">
              <p className="num text-caption text-copper-600">Step {index + 1}</p>
              <h2 className="mt-1 text-lead font-semibold">{step.title}</h2>
              <p className="mt-2 text-ink-700">{step.text}</p>
            </li>
          ))}
        </ol>
        <div className="mt-10">
          <CautionNotice />
        </div>
      </main>
    </div>
  );
}
