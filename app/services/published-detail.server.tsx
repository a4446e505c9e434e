import { renderToStaticMarkup } from "react-dom/server";
import { CalculationTrail, ComponentTable } from "~/components/design-panels";
import { axisNamesOf, servedBy, type DetailPart, type PublishedDesign } from "./published-design";
import { renderedOnce } from "./render-cache.server";

/**
 * A published revision's bill or calculation trail as HTML, rendered once per revision (a
 * published revision never changes) and kept by the render cache. The spec page sends it only
 * when the reader opens that section.
 */
export function publishedDetailHtml(revisionId: string, part: DetailPart, published: PublishedDesign): string {
  return renderedOnce(`revision:${revisionId}:${part}`, () => {
    if (part === "trail") return renderToStaticMarkup(<CalculationTrail trail={published.design.trail} />);
    const names = axisNamesOf(published);
    return renderToStaticMarkup(<ComponentTable design={published.design} servedBy={names.length ? (line) => servedBy(line.key, names) : undefined} />);
  });
}
