import { CalendarHeart, ClipboardCheck, HeartHandshake, Ruler, Truck } from 'lucide-react';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { useDrive } from '@/features/drive/api/get-drive';
import { useMe } from '@/features/auth/api/get-me';
import { formatDay } from '@/components/ui/format-day';
import { useDocumentTitle } from '@/components/ui/document-title';

const steps = [
  { icon: HeartHandshake, title: 'Pledge', text: 'See what each neonatal unit, ward, shelter and care home needs, and promise what you can make.' },
  { icon: Ruler, title: 'Plan', text: 'Work out the size from your swatch and make the border fit its stitch multiple before you start it.' },
  { icon: CalendarHeart, title: 'Log and drop off', text: 'Record each finished blanket with its size and yarn, print its tag and bring it to a drop-off point.' },
  { icon: ClipboardCheck, title: 'Check', text: "Organisers measure and check each blanket against the recipient's own rules, and find another home for what fits elsewhere." },
  { icon: Truck, title: 'Deliver', text: 'The coordinator plans delivery runs and sends each recipient a clear list of what is in the boxes.' },
];

export default function HomePage() {
  const { data } = useDrive();
  const { data: user } = useMe();
  const drive = data?.drive;
  useDocumentTitle(drive ? `${drive.name}, ${drive.town}` : 'Handmade blankets for the drive');
  return (
    <div className="space-y-10">
      <section className="grid items-center gap-8 rounded-3xl bg-heather-800 px-6 py-10 text-white sm:px-10 md:grid-cols-[3fr_2fr]">
        <div>
          <p className="mb-2 font-bold uppercase tracking-wide text-marigold-300">{drive ? `${drive.town} · blanket drive` : 'Blanket drive'}</p>
          <h1 className="text-4xl font-bold leading-tight sm:text-5xl">{drive?.name ?? 'Handmade blankets, to where they are needed'}</h1>
          <p className="mt-4 max-w-prose text-lg text-heather-50">{drive?.summary ?? 'Kindloop helps community groups run charity blanket drives.'}</p>
          {drive && (
            <p className="mt-4 font-bold text-marigold-300">
              Blankets wanted until {formatDay(drive.endsOn)} · {data?.volunteers ?? 0} makers so far
            </p>
          )}
          <div className="mt-6 flex flex-wrap gap-3">
            {user ? (
              <ButtonLink to="/home" size="lg" variant="accent">
                Go to your page
              </ButtonLink>
            ) : (
              <ButtonLink to="/register" size="lg" variant="accent">
                Join as a maker
              </ButtonLink>
            )}
            <ButtonLink to="/planner" size="lg" variant="secondary">
              Try the border planner
            </ButtonLink>
          </div>
        </div>
        <BlanketPicture />
      </section>

      <section aria-labelledby="how">
        <h2 id="how" className="mb-4 text-2xl font-bold">
          How the drive works
        </h2>
        <ol className="grid gap-4 sm:grid-cols-2 lg:grid-cols-5">
          {steps.map((s, i) => (
            <li key={s.title}>
              <Card className="h-full">
                <s.icon className="mb-2 size-8 text-heather-700" aria-hidden />
                <h3 className="text-lg font-bold">
                  {i + 1}. {s.title}
                </h3>
                <p className="text-ink-soft">{s.text}</p>
              </Card>
            </li>
          ))}
        </ol>
      </section>

      <section className="rounded-2xl border-2 border-marigold-300 bg-marigold-100 p-6">
        <h2 className="text-xl font-bold">Blankets for babies and frail people</h2>
        <p className="mt-2 max-w-prose">
          A blanket for a baby is for cuddles and supervised tummy time, never loose in the cot. Nothing that can come off
          (buttons, beads, safety eyes), no cords or ribbons, no open lace that catches fingers. Each unit sets its own rules,
          and its policy comes first.
        </p>
      </section>
    </div>
  );
}

/** A granny-square blanket drawn in the palette: a picture says "blanket drive" faster than a paragraph. */
function BlanketPicture() {
  const colours = ['var(--color-marigold-400)', 'var(--color-moss-500)', 'var(--color-heather-300)', 'var(--color-brick-500)', 'var(--color-oat-200)'];
  const squares = [];
  for (let r = 0; r < 4; r++)
    for (let c = 0; c < 4; c++) {
      const x = 20 + c * 50;
      const y = 20 + r * 50;
      const k = (r * 4 + c) % 5;
      squares.push(
        <g key={`${r}-${c}`}>
          <rect x={x} y={y} width="48" height="48" rx="4" fill={colours[k]} />
          <rect x={x + 10} y={y + 10} width="28" height="28" rx="3" fill={colours[(k + 2) % 5]} />
          <rect x={x + 18} y={y + 18} width="12" height="12" rx="2" fill="var(--color-oat-50)" />
        </g>,
      );
    }
  return (
    <svg viewBox="0 0 240 240" className="mx-auto w-full max-w-xs drop-shadow-lg" role="img" aria-label="A patchwork blanket of crocheted squares">
      <rect x="8" y="8" width="224" height="224" rx="12" fill="var(--color-oat-100)" stroke="var(--color-marigold-300)" strokeWidth="6" strokeDasharray="10 6" />
      {squares}
    </svg>
  );
}
