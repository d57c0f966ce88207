import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { Figure } from "@/components/home/figure";

const text = (value: number) =>
  renderToStaticMarkup(createElement(Figure, { one: "approved version in use", many: "approved versions in use", value, href: "/protocols" })).replace(/<[^>]+>/g, " ").replace(/\s+/g, " ").trim();

describe("home page figures", () => {
  it("agree the noun with the number: '1 approved version in use', never '1 approved versions'", () => {
    expect(text(1)).toBe("1 approved version in use");
    expect(text(0)).toBe("0 approved versions in use");
    expect(text(2)).toBe("2 approved versions in use");
  });
});
