"use client";

import { useEffect, useState } from "react";

export function ThemeToggle() {
  const [dark, setDark] = useState<boolean | null>(null);
  useEffect(() => setDark(document.documentElement.classList.contains("dark")), []);

  function toggle() {
    const next = !document.documentElement.classList.contains("dark");
    document.documentElement.classList.toggle("dark", next);
    localStorage.setItem("threadline-theme", next ? "dark" : "light");
    setDark(next);
  }

  return (
    <button type="button" onClick={toggle} className="btn btn-secondary border-white/60 text-white" aria-pressed={dark ?? undefined}>
      <span aria-hidden="true">{dark ? "☀" : "☾"}</span>
      <span>{dark ? "Day" : "Night"}</span>
    </button>
  );
}
