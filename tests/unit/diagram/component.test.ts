import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { OneLineDiagram, OneLineDiagramView } from "@/components/diagram/one-line-diagram";
import { layoutOneLine } from "@/lib/diagram/layout";
import { standAlone } from "./fixtures";

describe("one-line diagram component", () => {
  it("shows a loading state before the layout is ready", () => {
    const html = renderToStaticMarkup(createElement(OneLineDiagram, { record: standAlone() }));
    expect(html).toContain('role="status"');
    expect(html).toContain("Drawing the one-line diagram");
  });

  it("draws boxes and circuits as focusable buttons when selection is wanted", async () => {
    const layout = await layoutOneLine(standAlone());
    const html = renderToStaticMarkup(
      createElement(OneLineDiagramView, { layout, heading: "One-line diagram", onSelect: () => {}, selectedTag: "INV-1" }),
    );
    expect(html).toContain(`viewBox="0 0 ${layout.width} ${layout.height}"`);
    expect(html).toContain('width="100%"');
    const buttons = html.match(/role="button"/g) ?? [];
    expect(buttons).toHaveLength(layout.nodes.length + layout.edges.length);
    expect(html).toContain('data-tag="INV-1"');
    expect(html).toContain('aria-pressed="true"');
    expect(html).toContain("2 #10 AWG Cu PV WIRE 90 °C");
    expect(html).not.toContain("dangerouslySetInnerHTML");
  });

  it("is a plain drawing without a selection handler", async () => {
    const layout = await layoutOneLine(standAlone());
    const html = renderToStaticMarkup(createElement(OneLineDiagramView, { layout, heading: "One-line diagram" }));
    expect(html).not.toContain('role="button"');
    expect(html).not.toContain("tabindex");
  });
});
