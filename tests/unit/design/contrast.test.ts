// The palette against WCAG 2.2's contrast minimums (published: WCAG 2.2, 1.4.3 Contrast (Minimum):
// text 4.5:1; 1.4.11 Non-text Contrast: the visual boundary of a control and a focus indicator 3:1),
// using WCAG's own relative-luminance formula. Every text colour on every paper it sits on.
import { describe, expect, it } from "vitest";
import config from "@/tailwind.config";

type Palette = Record<string, Record<string, string>>;
const colors = (config.theme?.extend?.colors ?? {}) as Palette;
const c = (name: string, shade = "DEFAULT") => {
  const value = colors[name]?.[shade];
  if (!value) throw new Error(`no colour ${name}.${shade}`);
  return value;
};

function luminance(hex: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((v) => (v <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!;
}
function ratio(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi! + 0.05) / (lo! + 0.05);
}

const papers = { paper: c("paper"), "paper-deep": c("paper", "deep"), "paper-card": c("paper", "card"), white: "#ffffff", "rust-wash": c("rust", "wash") };

describe("contrast (WCAG 2.2 1.4.3, 1.4.11)", () => {
  it.each([
    ["ink", c("ink")],
    ["ink-soft", c("ink", "soft")],
    ["ink-faint", c("ink", "faint")],
    ["rust-deep", c("rust", "deep")],
  ])("text colour %s reads at 4.5:1 or more on every paper", (_name, fg) => {
    for (const [paper, bg] of Object.entries(papers)) expect(ratio(fg, bg), `${_name} on ${paper}`).toBeGreaterThanOrEqual(4.5);
  });

  it("input and control borders (rule-strong) stand out 3:1 from the paper around them and the field inside", () => {
    for (const [paper, bg] of Object.entries(papers)) expect(ratio(c("rule", "strong"), bg), `rule-strong on ${paper}`).toBeGreaterThanOrEqual(3);
  });

  it("the focus ring (rust) stands out 3:1 on every paper", () => {
    for (const [paper, bg] of Object.entries(papers)) expect(ratio(c("rust"), bg), `rust on ${paper}`).toBeGreaterThanOrEqual(3);
  });

  it("white on the rust button reads at 4.5:1", () => {
    expect(ratio("#ffffff", c("rust"))).toBeGreaterThanOrEqual(4.5);
    expect(ratio("#ffffff", c("rust", "deep"))).toBeGreaterThanOrEqual(4.5);
  });
});
