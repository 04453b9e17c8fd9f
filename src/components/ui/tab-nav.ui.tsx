import { NavLink } from 'react-router-dom';

/** A row of page-level tabs (links), the current one underlined in the accent colour. */
export function TabNav({ label, items }: { label: string; items: { label: string; to: string }[] }) {
  return (
    <nav aria-label={label} className="flex gap-1 border-b border-line">
      {items.map((item) => (
        <NavLink
          key={item.to}
          to={item.to}
          end
          className={({ isActive }) =>
            `-mb-px border-b-2 px-3 py-2 text-sm ${
              isActive ? 'border-accent font-medium text-ink' : 'border-transparent text-ink-soft hover:text-ink'
            }`
          }
        >
          {item.label}
        </NavLink>
      ))}
    </nav>
  );
}
