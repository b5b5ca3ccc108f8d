import { useFieldArray } from 'react-hook-form';
import type { Control, FieldErrors, UseFormRegister } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { controlClass } from '@/components/ui/field';
import type { SettingsFormValues } from './settings-schema';

interface Props {
  control: Control<SettingsFormValues, unknown, unknown>;
  register: UseFormRegister<SettingsFormValues>;
  errors: FieldErrors<SettingsFormValues>;
}

/** Editable rows of the grade scheme; exports carry both code and label, so both stay editable. */
export function GradeSchemeFields({ control, register, errors }: Props) {
  const { fields, append, remove, move } = useFieldArray({ control, name: 'gradeScheme' });
  const schemeError = errors.gradeScheme?.message ?? errors.gradeScheme?.root?.message;

  const addGrade = () => {
    // Codes are words; a new row starts with one that is free ("grade-6"), for the lead to rename.
    const taken = new Set(fields.map((f) => String(f.code)));
    let n = fields.length + 1;
    while (taken.has(`grade-${n}`)) n++;
    append({ code: `grade-${n}`, label: '', meaning: '' }, { shouldFocus: true });
  };

  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-1 text-sm font-medium text-ink-800">Grade scheme</legend>
      <p className="text-sm text-ink-500">Highest confidence first. Codes are short words or letters (no spaces); codes and labels must be unique.</p>
      <div className="grid grid-cols-[5rem_10rem_1fr_auto] gap-x-2 gap-y-1.5" role="group" aria-label="Grades">
        <span aria-hidden="true" className="text-xs font-semibold uppercase tracking-wide text-ink-500">Code</span>
        <span aria-hidden="true" className="text-xs font-semibold uppercase tracking-wide text-ink-500">Label</span>
        <span aria-hidden="true" className="col-span-2 text-xs font-semibold uppercase tracking-wide text-ink-500">Meaning</span>
        {fields.map((field, i) => {
          const rowErrors = errors.gradeScheme?.[i];
          const rowMessage = rowErrors?.code?.message ?? rowErrors?.label?.message ?? rowErrors?.meaning?.message;
          return (
            <div key={field.id} className="contents">
              <input
                aria-label={`Code of grade ${i + 1}`}
                aria-invalid={rowErrors?.code ? true : undefined}
                className={`${controlClass} num`}
                {...register(`gradeScheme.${i}.code`)}
              />
              <input
                aria-label={`Label of grade ${i + 1}`}
                aria-invalid={rowErrors?.label ? true : undefined}
                className={controlClass}
                {...register(`gradeScheme.${i}.label`)}
              />
              <input
                aria-label={`Meaning of grade ${i + 1}`}
                aria-invalid={rowErrors?.meaning ? true : undefined}
                className={controlClass}
                {...register(`gradeScheme.${i}.meaning`)}
              />
              {/* Order is meaningful: "one step apart" in a disagreement is counted along this list. */}
              <div className="flex items-center gap-0.5">
                <Button variant="quiet" size="sm" aria-label={`Move grade ${i + 1} up`} disabled={i === 0} onClick={() => move(i, i - 1)}>
                  ↑
                </Button>
                <Button variant="quiet" size="sm" aria-label={`Move grade ${i + 1} down`} disabled={i === fields.length - 1} onClick={() => move(i, i + 1)}>
                  ↓
                </Button>
                <Button variant="quiet" size="sm" aria-label={`Remove grade ${i + 1}`} onClick={() => remove(i)}>
                  Remove
                </Button>
              </div>
              {rowMessage ? (
                <p className="col-span-4 text-sm text-danger-700">
                  Grade {i + 1}: {rowMessage}
                </p>
              ) : null}
            </div>
          );
        })}
      </div>
      {schemeError ? (
        <p role="alert" className="text-sm text-danger-700">
          {schemeError}
        </p>
      ) : null}
      <div>
        <Button variant="secondary" size="sm" onClick={addGrade}>
          Add grade
        </Button>
      </div>
    </fieldset>
  );
}
