import { useEffect, useId, useMemo, useRef, useState } from 'react';
import type { BorderPlan } from '@shared/border/plan';
import type { BorderPattern } from '@shared/border/library';
import { EDGE_ORDER, type EdgeName } from '@shared/border/round';
import { CORNER_MARK_DISTANCE, fanPath, fanSpokes, f2, layoutDrawing, outward, type RepeatShape } from './drawing-geometry';

interface Props {
  plan: BorderPlan;
  border: BorderPattern;
  bodyWidth: number;
  bodyHeight: number;
  rows: number;
  /** How the proportions were found, for the caption. */
  proportion: string;
}

/** How each library border is drawn: what one repeat looks like from above. */
type Look = 'shell' | 'picot-shell' | 'scallop' | 'picot' | 'v' | 'bobble' | 'band';
const LOOKS: Record<string, Look> = {
  'five-dc-shell': 'shell',
  'picot-tipped-shell': 'picot-shell',
  'wide-scallop': 'scallop',
  'picot-ribbon': 'picot',
  'open-v-lattice': 'v',
  'bobble-dots': 'bobble',
};

const EDGE_WORD: Record<EdgeName, string> = { top: 'Top', right: 'Right side', bottom: 'Bottom', left: 'Left side' };

function Repeat({ s, look, legend = false }: { s: RepeatShape; look: Look; legend?: boolean }) {
  const testId = legend ? undefined : 'border-repeat';
  switch (look) {
    case 'shell':
    case 'picot-shell':
    case 'scallop': {
      const depth = look === 'scallop' ? 0.8 : 1;
      const spokes = look === 'scallop' ? 7 : 5;
      const tip = outward(s, s.angle, s.size * depth + 3);
      return (
        <g data-testid={testId}>
          <path d={fanPath(s, depth)} className="fill-heather-300 stroke-heather-800" strokeWidth={1.4} />
          {s.size >= 8 &&
            fanSpokes(s, spokes, depth).map(([a, b], i) => (
              <line key={i} x1={f2(a.x)} y1={f2(a.y)} x2={f2(b.x)} y2={f2(b.y)} className="stroke-heather-700" strokeWidth={0.9} />
            ))}
          {look === 'picot-shell' && <circle cx={f2(tip.x)} cy={f2(tip.y)} r={3} className="fill-white stroke-heather-800" strokeWidth={1.4} />}
        </g>
      );
    }
    case 'picot': {
      const c = outward(s, s.angle, 6);
      return (
        <g data-testid={testId}>
          <circle cx={f2(c.x)} cy={f2(c.y)} r={4.5} className="fill-white stroke-heather-800" strokeWidth={1.6} />
        </g>
      );
    }
    case 'bobble': {
      const c = outward(s, s.angle, Math.min(9, s.size) + 2);
      return (
        <g data-testid={testId}>
          <circle cx={f2(c.x)} cy={f2(c.y)} r={f2(Math.min(9, s.size))} className="fill-heather-300 stroke-heather-800" strokeWidth={1.4} />
        </g>
      );
    }
    case 'v': {
      const tx = Math.cos(s.angle + Math.PI / 2);
      const ty = Math.sin(s.angle + Math.PI / 2);
      const h = Math.max(6, s.size * 1.4);
      const top = outward(s, s.angle, h);
      const a = { x: top.x - s.size * 0.7 * tx, y: top.y - s.size * 0.7 * ty };
      const b = { x: top.x + s.size * 0.7 * tx, y: top.y + s.size * 0.7 * ty };
      return (
        <g data-testid={testId}>
          <path d={`M${f2(a.x)} ${f2(a.y)} L${f2(s.x)} ${f2(s.y)} L${f2(b.x)} ${f2(b.y)}`} fill="none" className="stroke-heather-800" strokeWidth={1.8} />
        </g>
      );
    }
    default:
      return null;
  }
}

/**
 * The blanket from above: the body to scale, the foundation round around it with a mark at each
 * stitch that changes, and the border's repeats where the round puts them.
 */
export function BlanketDrawing({ plan, border, bodyWidth, bodyHeight, rows, proportion }: Props) {
  const id = useId();
  const box = useRef<HTMLElement>(null);
  const [space, setSpace] = useState(640);
  useEffect(() => {
    const el = box.current;
    if (!el || typeof ResizeObserver === 'undefined') return;
    // Steps of 20 px: a scrollbar appearing should not redraw the whole blanket.
    const ro = new ResizeObserver(([entry]) => setSpace(Math.round(entry!.contentRect.width / 20) * 20));
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  const d = useMemo(() => layoutDrawing(plan, border, bodyWidth, bodyHeight, rows, space), [plan, border, bodyWidth, bodyHeight, rows, space]);
  const look: Look = border.multiple === 1 ? 'band' : (LOOKS[border.id] ?? 'shell');
  const { body, foundation: f } = d;
  const adds = d.marks.filter((m) => m.kind === 'add').length;
  const skips = d.marks.filter((m) => m.kind === 'skip').length;
  const font = 16;
  /** The longest label that fits along the edge: with its name, the counts only, or nothing. */
  const label = (edge: EdgeName) => {
    const e = plan.edges[edge];
    const counts = e.change === 0 ? `${e.count}` : `${e.count} → ${e.fitted}`;
    const room = (edge === 'top' || edge === 'bottom' ? body.w : body.h) - 40;
    const fits = (text: string) => text.length * font * 0.62 <= room;
    const full = `${EDGE_WORD[edge]} ${counts}`;
    return fits(full) ? full : fits(counts) ? counts : '';
  };
  const summary =
    `Blanket body ${plan.edges.top.count} stitches across and ${plan.edges.right.count} foundation stitches down each side. ` +
    `${adds ? `${adds} marked stitches take extra stitches. ` : ''}${skips ? `${skips} marked stitches are skipped. ` : ''}` +
    (look === 'band' ? `${border.name} all round.` : `${plan.round.repeats} border repeats drawn around the edge.`);

  return (
    <figure ref={box} className="break-inside-avoid">
      <svg
        viewBox={`0 0 ${f2(d.width)} ${f2(d.height)}`}
        className="h-auto max-h-[80vh] w-full print:mx-auto print:max-h-[16cm]"
        role="img"
        aria-labelledby={`${id}-t`}
        aria-describedby={`${id}-d`}
        data-testid="blanket-drawing"
      >
        <title id={`${id}-t`}>Drawing of the blanket and its border</title>
        <desc id={`${id}-d`}>{summary}</desc>

        {look === 'band' && (
          <>
            <rect
              x={f2(f.x - 14)}
              y={f2(f.y - 14)}
              width={f2(f.w + 28)}
              height={f2(f.h + 28)}
              rx={4}
              fill="none"
              className="stroke-heather-300"
              strokeWidth={border.rounds > 1 ? 10 : 8}
            />
            <rect
              x={f2(f.x - 14)}
              y={f2(f.y - 14)}
              width={f2(f.w + 28)}
              height={f2(f.h + 28)}
              rx={4}
              fill="none"
              className="stroke-heather-800"
              strokeWidth={2}
              strokeDasharray={border.id === 'crab-stitch-edge' ? '5 3' : undefined}
            />
          </>
        )}
        {d.repeats.map((s) => (
          <Repeat key={s.number} s={s} look={look} />
        ))}

        <rect x={f2(body.x)} y={f2(body.y)} width={f2(body.w)} height={f2(body.h)} className="fill-oat-100 stroke-ink" strokeWidth={2} />
        {d.rowLines.map((y, i) => (
          <line key={i} x1={f2(body.x)} x2={f2(body.x + body.w)} y1={f2(y)} y2={f2(y)} className="stroke-oat-300" strokeWidth={0.8} />
        ))}
        <rect x={f2(f.x)} y={f2(f.y)} width={f2(f.w)} height={f2(f.h)} fill="none" className="stroke-heather-700" strokeWidth={2.5} />

        {d.corners.map((c) => {
          const p = outward(c, c.angle, CORNER_MARK_DISTANCE);
          return (
            <g key={c.corner} data-testid="corner-mark" data-centred={c.centred}>
              <circle cx={f2(p.x)} cy={f2(p.y)} r={11} className={c.centred ? 'fill-moss-100 stroke-moss-700' : 'fill-white stroke-brick-700'} strokeWidth={2.5} strokeDasharray={c.centred ? undefined : '4 3'} />
              <text x={f2(p.x)} y={f2(p.y + 5)} textAnchor="middle" fontSize={14} fontWeight={700} className={c.centred ? 'fill-moss-700' : 'fill-brick-700'}>
                {c.centred ? '✓' : '–'}
              </text>
            </g>
          );
        })}

        {d.marks.map((m) => (
          <g key={`${m.edge}-${m.stitch}`} data-testid="foundation-mark" data-edge={m.edge} data-kind={m.kind}>
            {m.kind === 'add' ? (
              <>
                <circle cx={f2(m.x)} cy={f2(m.y)} r={8} className="fill-marigold-400 stroke-ink" strokeWidth={1.6} />
                <path d={`M${f2(m.x - 4)} ${f2(m.y)} H${f2(m.x + 4)} M${f2(m.x)} ${f2(m.y - 4)} V${f2(m.y + 4)}`} className="stroke-ink" strokeWidth={2} />
              </>
            ) : (
              <>
                <circle cx={f2(m.x)} cy={f2(m.y)} r={8} className="fill-brick-100 stroke-brick-700" strokeWidth={1.8} />
                <path d={`M${f2(m.x - 3.5)} ${f2(m.y - 3.5)} L${f2(m.x + 3.5)} ${f2(m.y + 3.5)} M${f2(m.x + 3.5)} ${f2(m.y - 3.5)} L${f2(m.x - 3.5)} ${f2(m.y + 3.5)}`} className="stroke-brick-700" strokeWidth={2} />
              </>
            )}
            {m.times > 1 && (
              <text x={f2(m.x + 10)} y={f2(m.y - 8)} fontSize={13} fontWeight={700} className="fill-ink">
                ×{m.times}
              </text>
            )}
          </g>
        ))}

        {/* Where the round begins and which way it goes. */}
        <path
          d={`M${f2(body.x + 8)} ${f2(body.y + 12)} h22 l-6 -6 m6 6 l-6 6`}
          fill="none"
          className="stroke-heather-800"
          strokeWidth={2.5}
          data-testid="start-arrow"
        />

        {EDGE_ORDER.map((edge) => {
          const inset = font * 1.3;
          const cx = body.x + body.w / 2;
          const cy = body.y + body.h / 2;
          const pos: Record<EdgeName, { x: number; y: number; rotate: number }> = {
            top: { x: cx, y: body.y + inset, rotate: 0 },
            bottom: { x: cx, y: body.y + body.h - inset + font * 0.7, rotate: 0 },
            right: { x: body.x + body.w - inset + font * 0.3, y: cy, rotate: 90 },
            left: { x: body.x + inset - font * 0.3, y: cy, rotate: -90 },
          };
          const p = pos[edge];
          return (
            <text key={edge} x={f2(p.x)} y={f2(p.y)} transform={p.rotate ? `rotate(${p.rotate} ${f2(p.x)} ${f2(p.y)})` : undefined} textAnchor="middle" fontSize={f2(font)} fontWeight={700} className="fill-ink">
              {label(edge)}
            </text>
          );
        })}
      </svg>
      <figcaption className="mt-3 space-y-3">
        <ul className="flex flex-wrap gap-x-6 gap-y-2 text-base" aria-label="Key to the drawing">
          <li className="flex items-center gap-2">
            <svg viewBox="-2 0 24 20" className="h-5 w-6 shrink-0" aria-hidden>
              <circle cx={10} cy={10} r={8} className="fill-marigold-400 stroke-ink" strokeWidth={1.6} />
              <path d="M6 10H14M10 6V14" className="stroke-ink" strokeWidth={2} />
            </svg>
            Extra stitch in the foundation round
          </li>
          <li className="flex items-center gap-2">
            <svg viewBox="-2 0 24 20" className="h-5 w-6 shrink-0" aria-hidden>
              <circle cx={10} cy={10} r={8} className="fill-brick-100 stroke-brick-700" strokeWidth={1.8} />
              <path d="M6.5 6.5L13.5 13.5M13.5 6.5L6.5 13.5" className="stroke-brick-700" strokeWidth={2} />
            </svg>
            Stitch to skip
          </li>
          {look !== 'band' && (
            <li className="flex items-center gap-2">
              <svg viewBox="-13 -17 26 20" className="h-5 w-6 shrink-0" aria-hidden>
                <Repeat s={{ x: 0, y: 0, angle: -Math.PI / 2, size: 10, number: 0, on: 'top' }} look={look} legend />
              </svg>
              One border repeat ({border.multiple} stitches)
            </li>
          )}
          <li className="flex items-center gap-2">
            <svg viewBox="0 0 24 24" className="h-5 w-6 shrink-0" aria-hidden>
              <circle cx={12} cy={12} r={9} className="fill-moss-100 stroke-moss-700" strokeWidth={2.5} />
            </svg>
            Corner with a repeat centred
          </li>
          <li className="flex items-center gap-2">
            <svg viewBox="0 0 24 24" className="h-5 w-6 shrink-0" aria-hidden>
              <circle cx={12} cy={12} r={9} className="fill-white stroke-brick-700" strokeWidth={2.5} strokeDasharray="4 3" />
            </svg>
            Corner without one
          </li>
          <li className="flex items-center gap-2">
            <svg viewBox="0 0 24 14" className="h-5 w-6 shrink-0" aria-hidden>
              <path d="M2 7h18l-5 -5m5 5l-5 5" fill="none" className="stroke-heather-800" strokeWidth={2} />
            </svg>
            Start of the round and its direction
          </li>
        </ul>
        <p className="text-sm text-ink-soft">
          {proportion}
          {d.squeezed ? ' Squeezed to fit the page: this blanket is longer and thinner than drawn.' : ''} Marks sit on the stitches the plan
          names, counted from the corner where each edge begins.
        </p>
      </figcaption>
    </figure>
  );
}
