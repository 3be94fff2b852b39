/** The labelled search box and select a list's filter bar is made of. */
export function SearchFilter({ id, label = "Search", placeholder, value, onChange }: { id: string; label?: string; placeholder: string; value: string; onChange: (value: string) => void }) {
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
      </label>
      <input id={id} type="search" className="input" placeholder={placeholder} value={value} maxLength={100} onChange={(e) => onChange(e.target.value)} />
    </div>
  );
}

export function SelectFilter({ id, label, value, options, onChange }: { id: string; label: string; value: string; options: readonly (readonly [value: string, label: string])[]; onChange: (value: string) => void }) {
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
      </label>
      <select id={id} className="input" value={value} onChange={(e) => onChange(e.target.value)}>
        {options.map(([optionValue, optionLabel]) => (
          <option key={optionValue} value={optionValue}>
            {optionLabel}
          </option>
        ))}
      </select>
    </div>
  );
}
