// One control of a GET filter form: a labelled select whose first option means "no filter".
export const filterControl = "min-h-11 rounded-lg border border-paper-line bg-paper-raised px-3 text-sm";

export function FilterSelect({
  label,
  name,
  defaultValue,
  options,
  anyLabel,
}: {
  label: string;
  name: string;
  defaultValue?: string | number;
  options: { value: string | number; label: string }[];
  /** The "no filter" option; omitted when the filter always has a value. */
  anyLabel?: string;
}) {
  return (
    <label className="flex flex-col text-xs font-medium text-ink-muted">
      {label}
      <select name={name} defaultValue={defaultValue ?? ""} className={filterControl}>
        {anyLabel ? <option value="">{anyLabel}</option> : null}
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
}
