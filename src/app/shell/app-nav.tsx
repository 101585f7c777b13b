import { NavLink } from "react-router";
import type { NavItem } from "./nav-items";

export function AppNav({ items }: { items: readonly NavItem[] }) {
  return (
    <nav aria-label="Main">
      <ul className="flex flex-wrap gap-1">
        {items.map((item) => (
          <li key={item.to}>
            <NavLink
              to={item.to}
              end={item.to === "/"}
              className={({ isActive }) =>
                `inline-flex min-h-11 items-center rounded-md px-3 font-bold no-underline ${
                  isActive ? "bg-accent text-on-accent" : "text-accent hover:bg-accent-soft"
                }`
              }
            >
              {item.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
