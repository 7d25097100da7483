'use client';
// One zone's checklist: each item answered OK, a defect, a reading, or "not checked" with a reason.
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';
import type { WalkStep } from '@/lib/inspection/store';
import type { VocabularyComponent, ZoneItem } from '@/lib/schemas/grammar';
import {
  measureUnit,
  notCheckedReasonLabel,
  notCheckedReasons,
  type ItemAnswer,
  type NotCheckedReason,
} from '@/lib/walk';
import { AirTimer, AnswerMark, capitalize, inputClass, ReadingResult } from './walk-parts';

export function ChecklistRow({
  item,
  answer,
  reading,
  required,
  onOk,
  onDefect,
  onReading,
  onNotChecked,
}: {
  item: ZoneItem;
  answer: ItemAnswer | undefined;
  reading: WalkStep | undefined;
  required: boolean;
  onOk: () => void;
  onDefect: () => void;
  onReading: (value: number) => void;
  onNotChecked: () => void;
}) {
  const [value, setValue] = useState('');
  const measure = item.measure;
  return (
    <li className={`space-y-2 ${panelClass({ padding: 'sm' })}`} data-item={item.id} id={`item-${item.id}`}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-xl font-bold">
          {capitalize(item.label)}
          {measure && !required && <span className="text-base font-normal text-muted"> (optional reading)</span>}
        </p>
        <AnswerMark answer={answer} />
      </div>
      {measure ? (
        <>
          {measure === 'air_leak' && <AirTimer mode="minute" />}
          {measure === 'air_buildup' && <AirTimer mode="stopwatch" onResult={(s) => onReading(s)} />}
          <form
            className="flex gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              const n = Number(value.replace(',', '.'));
              if (value.trim() && Number.isFinite(n)) onReading(n);
              setValue('');
            }}
          >
            <input
              className={`${inputClass} min-w-0 flex-1`}
              inputMode="decimal"
              value={value}
              onChange={(e) => setValue(e.target.value)}
              aria-label={`${item.label} in ${measureUnit[measure]}`}
              placeholder={measureUnit[measure] === '32nds' ? 'e.g. 6 (/32 in)' : measureUnit[measure]}
            />
            <Button type="submit" tone="primary" size="touch">
              Record
            </Button>
          </form>
          <ReadingResult step={reading} />
          <Button onClick={onNotChecked} aria-label={`${item.label}: not checked`}>
            Not checked…
          </Button>
        </>
      ) : (
        <div className="grid grid-cols-2 gap-2">
          <Button onClick={onOk} aria-label={`${item.label}: OK`}>
            ✓ OK
          </Button>
          <Button onClick={onDefect} aria-label={`${item.label}: defect`}>
            ▲ Defect
          </Button>
          <div className="col-span-2">
            <Button onClick={onNotChecked} aria-label={`${item.label}: not checked`}>
              Not checked…
            </Button>
          </div>
        </div>
      )}
    </li>
  );
}

/** The defects a component can have, as buttons. */
export function DefectPicker({
  item,
  component,
  conditionName,
  onPick,
  onCancel,
}: {
  item: ZoneItem;
  component: VocabularyComponent | undefined;
  conditionName: ReadonlyMap<string, string>;
  onPick: (termKey: string) => void;
  onCancel: () => void;
}) {
  return (
    <section aria-label={`Defect on ${item.label}`} className={`space-y-2 ${panelClass({ padding: 'sm' })}`}>
      <p className="text-xl font-bold">What is wrong with the {item.label}?</p>
      <div className="grid grid-cols-2 gap-2">
        {(component?.defects ?? []).map((d) => (
          <Button key={d.condition} onClick={() => onPick(`${item.component}:${d.condition}`)}>
            {conditionName.get(d.condition) ?? d.condition}
          </Button>
        ))}
      </div>
      <Button onClick={onCancel}>Cancel</Button>
    </section>
  );
}

/** Why an item was not checked: the short list, and a note for "other". */
export function NotCheckedPicker({
  item,
  onPick,
  onCancel,
}: {
  item: ZoneItem;
  onPick: (reason: NotCheckedReason, note: string | null) => void;
  onCancel: () => void;
}) {
  const [other, setOther] = useState(false);
  const [note, setNote] = useState('');
  return (
    <section aria-label={`Why ${item.label} was not checked`} className={`space-y-2 ${panelClass({ padding: 'sm' })}`}>
      <p className="text-xl font-bold">Why was the {item.label} not checked?</p>
      <div className="grid grid-cols-2 gap-2">
        {notCheckedReasons
          .filter((r) => r !== 'other')
          .map((r) => (
            <Button key={r} onClick={() => onPick(r, null)}>
              {capitalize(notCheckedReasonLabel[r])}
            </Button>
          ))}
        <Button onClick={() => setOther(true)} aria-pressed={other}>
          Other…
        </Button>
      </div>
      {other && (
        <form
          className="flex gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            if (note.trim()) onPick('other', note.trim());
          }}
        >
          <input
            className={`${inputClass} min-w-0 flex-1`}
            value={note}
            maxLength={300}
            onChange={(e) => setNote(e.target.value)}
            aria-label="Why, in a few words"
            placeholder="Why, in a few words"
          />
          <Button type="submit" size="touch" disabled={!note.trim()}>
            Save
          </Button>
        </form>
      )}
      <Button onClick={onCancel}>Cancel</Button>
    </section>
  );
}
