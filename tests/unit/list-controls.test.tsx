/**
 * The shared parts of every list page: the table with its header, "nothing matches" line and
 * page links; the sort links that keep the search and state the current order; the filters.
 */
import { renderToStaticMarkup } from "react-dom/server";
import { createRoutesStub } from "react-router";
import { describe, expect, it } from "vitest";
import { FilterSelects, ListTable, SortChoice } from "~/components/ui";
import { LIST_SORTS, sortParam } from "~/schemas/list-sort";

const render = (element: React.ReactElement) => {
  const Stub = createRoutesStub([{ path: "/admin/users", Component: () => element }]);
  return renderToStaticMarkup(<Stub initialEntries={["/admin/users"]} />);
};

describe("ListTable", () => {
  it("heads its columns, says when nothing matches, and pages while keeping the search", () => {
    const search = new URLSearchParams("q=acme&sort=name&page=2");
    const html = render(
      <ListTable
        label="Users"
        columns={["Name", { label: "Total", className: "text-right" }, { label: "", srLabel: "Action" }]}
        empty="No user matches that search."
        pager={{ page: 2, pageCount: 3, search }}
      >
        {[]}
      </ListTable>,
    );
    const parts = [
      '<th scope="col" class="py-2 pr-3 ">Name</th>',
      'class="py-2 pr-3 text-right">Total</th>',
      '<span class="sr-only">Action</span>',
      "No user matches that search.",
      'href="/admin/users?q=acme&amp;sort=name&amp;page=1"',
      'href="/admin/users?q=acme&amp;sort=name&amp;page=3"',
    ];
    for (const part of parts) expect(html).toContain(part);
  });

  it("says nothing about an empty search when there are rows", () => {
    const html = render(
      <ListTable label="Users" columns={["Name"]} empty="No user matches that search.">
        {[
          <tr key="1">
            <td>Priya</td>
          </tr>,
        ]}
      </ListTable>,
    );
    expect(html).toContain("<td>Priya</td>");
    expect(html).not.toContain("No user matches");
  });
});

describe("SortChoice", () => {
  it("marks the current order and links the others back to page 1 with the search kept", () => {
    const html = render(<SortChoice options={LIST_SORTS.users} current="name" search={new URLSearchParams("q=acme&page=4")} />);
    expect(html).toContain('aria-current="true"');
    expect(html).toMatch(/aria-current="true"[^>]*>Name A–Z</);
    expect(html).toContain('href="/admin/users?q=acme&amp;sort=newest"');
    expect(html).not.toContain("page=4");
  });
});

describe("sortParam", () => {
  it("takes a known order and falls back to the list's first for anything else", () => {
    expect(sortParam("mail").parse("recipient")).toBe("recipient");
    for (const bad of [undefined, "", "RECIPIENT", "name", "x".repeat(10_000), ["recipient", "name"]]) {
      expect(sortParam("mail").parse(bad)).toBe("last-tried");
    }
    expect(sortParam("accounts").parse(undefined)).toBe("name");
  });
});

describe("FilterSelects", () => {
  it("shows what the URL asks for, with an 'any' choice first", () => {
    const html = render(
      <FilterSelects
        filters={[{ name: "kind", label: "Kind", any: "All kinds", options: [{ value: "shop", label: "Fluid-power shop" }] }]}
        search={new URLSearchParams("kind=shop")}
      />,
    );
    expect(html).toContain('<label for="kind" class="sr-only">Kind</label>');
    expect(html).toContain('<option value="">All kinds</option><option value="shop" selected="">Fluid-power shop</option>');
  });
});
