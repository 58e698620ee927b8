import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { WorkspaceErrorView } from "@/components/workspace/workspace-error-view";

describe("a workspace page that failed says so in Benchfold's words", () => {
  it("shows the reference to quote and offers to try again", () => {
    const html = renderToStaticMarkup(createElement(WorkspaceErrorView, { reference: "2718281828", onRetry: () => undefined }));
    expect(html).toContain("This page could not be loaded");
    expect(html).toContain("quote the reference below");
    expect(html).toContain("2718281828");
    expect(html).toContain("Try again");
  });

  it("asks for no reference when the error carries none", () => {
    const html = renderToStaticMarkup(createElement(WorkspaceErrorView, { reference: null }));
    expect(html).toContain("tell your administrator.");
    expect(html).not.toContain("Reference");
  });
});
