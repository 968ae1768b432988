"use client";

import { useEffect, useState } from "react";

/**
 * Charts animate only for people who have not asked for reduced motion, never when printing and
 * never when the page says so (`<html data-static-charts>` or a `static` prop). Browser tests
 * emulate reduced motion, so screenshots show finished charts.
 */
export function useChartAnimation(staticProp?: boolean): boolean {
  const [animate, setAnimate] = useState(false);
  useEffect(() => {
    if (staticProp) return;
    const reduce = window.matchMedia("(prefers-reduced-motion: reduce)");
    const print = window.matchMedia("print");
    const update = () => setAnimate(!reduce.matches && !print.matches && !document.documentElement.hasAttribute("data-static-charts"));
    update();
    reduce.addEventListener("change", update);
    print.addEventListener("change", update);
    return () => {
      reduce.removeEventListener("change", update);
      print.removeEventListener("change", update);
    };
  }, [staticProp]);
  return animate;
}

/** Stoke's chart colours (their own palette, shared with the status badges in the stylesheet). */
export const CHART_COLOURS = {
  fuel: "#9a3e12",
  carbon: "#4f5b63",
  upstream: "#c99a2e",
  fossil: "#4f5b63",
  biogenic: "#7fa37a",
  line: "#9a3e12",
  second: "#2f5f8a",
  third: "#8a8f94",
  pass: "#2f6b3a",
  warn: "#b27a00",
  fail: "#a4221b",
  limit: "#a4221b",
  grid: "#e6e2da",
} as const;

export const axisTick = { fontSize: 12, fill: "#5d676f" } as const;
/** Gap between a horizontal axis's tick marks and their labels, px: the label's box (its font's leading included) clears the mark. */
export const AXIS_TICK_MARGIN = 5;

export function shortNumber(v: number): string {
  if (!Number.isFinite(v)) return "";
  if (v === 0) return "0";
  const a = Math.abs(v);
  if (a >= 1e6) return `${(v / 1e6).toFixed(a >= 1e7 ? 0 : 1)}M`;
  if (a >= 1e4) return `${(v / 1e3).toFixed(0)}k`;
  if (a >= 100) return v.toFixed(0);
  if (a >= 10) return v.toFixed(1);
  return v.toFixed(2);
}
