import { useState } from 'react';
import { Baby } from 'lucide-react';
import { Alert } from '@/components/ui/alert';
import { Checkbox } from '@/components/ui/field';
import type { BorderPattern } from '@shared/border/library';
import { cautionsFor } from '@shared/guidelines/cautions';

/** Chain loops stand proud of the edge; some units for babies ask for none at all (common practice). */
const hasLoops = (b: BorderPattern) => /sl st in \d\w* ch from hook/.test(b.instructions);

export function SafetyNotes({ border }: { border: BorderPattern }) {
  const [forBaby, setForBaby] = useState(false);
  const cautions = cautionsFor('infant');
  return (
    <div className="space-y-3" data-testid="safety-notes">
      {border.openWork && (
        <Alert kind="warning" title="Open border: check before you make it for a baby">
          This border leaves gaps a small finger or toe can slip into. Neonatal and baby units often refuse open lace and open borders; the
          receiving facility's own policy decides.
        </Alert>
      )}
      {!border.openWork && hasLoops(border) && (
        <Alert kind="info" title="Small chain loops">
          The picots are small closed loops. Some units for babies still ask for no loops of any kind at the edge; check the receiving facility's
          policy first.
        </Alert>
      )}
      <Checkbox
        checked={forBaby}
        onChange={(e) => setForBaby(e.target.checked)}
        label={
          <span className="inline-flex items-center gap-2">
            <Baby className="size-5 text-heather-700" aria-hidden /> This blanket is for a baby or a premature baby
          </span>
        }
      />
      {forBaby && (
        <Alert kind="warning" title="For babies">
          <ul className="list-disc space-y-2 pl-5">
            {cautions.map((c) => (
              <li key={c.id}>
                {c.text} <span className="text-sm text-ink-soft">Source: {c.source}.</span>
              </li>
            ))}
          </ul>
        </Alert>
      )}
    </div>
  );
}
