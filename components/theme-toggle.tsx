"use client";

import { useEffect, useState } from "react";
import { Button } from "@/components/ui/button";

// Bright for the shop floor, dim for a dark bench corner; remembered on this device.
export function ThemeToggle() {
  const [dim, setDim] = useState(false);
  useEffect(() => setDim(document.documentElement.classList.contains("dim")), []);
  function toggle() {
    const next = !dim;
    document.documentElement.classList.toggle("dim", next);
    try {
      localStorage.setItem("tw-theme", next ? "dim" : "bright");
    } catch {
      /* private mode: the choice lasts for this page only */
    }
    setDim(next);
  }
  return (
    <Button tone="quiet" onClick={toggle} aria-pressed={dim} title="Switch between bright and dim screens">
      {dim ? "Bright" : "Dim"}
    </Button>
  );
}
