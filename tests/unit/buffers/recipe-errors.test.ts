import { describe, expect, it } from "vitest";
import { recipeFieldIssues } from "@/lib/buffers/recipe-errors";
import { evaluateBuffer } from "@/lib/dielectric";
import { predictRecipe as predictLibraryRecipe } from "@/lib/buffers/recipe";
import { defaultBuffer, predictRecipe } from "@/lib/wizard/buffer-form";

const engineError = (recipe: Parameters<typeof evaluateBuffer>[0]): unknown => {
  try {
    evaluateBuffer(recipe);
  } catch (err) {
    return err;
  }
  throw new Error("the engine accepted the recipe");
};

describe("recipe problems as field messages", () => {
  it("puts an addition's problem on that line's amount field, named by line and addition, without engine paths", () => {
    const err = engineError({ volumeL: 1, temperatureC: 25, sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [{ kind: "KCl", grams: 0.1 }, { kind: "PBS1x", volumeL: -0.0001 }] });
    const issues = recipeFieldIssues(err, ["KCl", "PBS1x"], "perLitre");
    expect(issues).toHaveLength(1);
    expect(issues[0].path).toBe("additions.1.perLitre");
    expect(issues[0].message).toMatch(/^Buffer additions, line 2 \(phosphate-buffered saline, 1×\): .*volume.*\(got -0\.0001\)\.$/);
    expect(issues[0].message).not.toContain("additions[");
  });

  it("names a base field by its label and maps it to the form's path", () => {
    const err = engineError({ volumeL: 1, temperatureC: 25, sucrosePercentWV: 45, glucosePercentWV: 0.3, additions: [] });
    expect(recipeFieldIssues(err, [], "perLitre", { sucrosePercentWV: "sucrosePercentWV" })).toEqual([
      { path: "sucrosePercentWV", message: expect.stringMatching(/^Sucrose: sucrose \(% w\/v\) must be between 0 and 30 % w\/v.*\(got 45\)\.$/) },
    ]);
  });

  it("the planner's and the library's recipe previews say which line is wrong, never 'Invalid request: additions[0]…'", () => {
    const wizard = predictRecipe({ ...defaultBuffer(), additions: [{ kind: "PBS1x", perLitre: -0.2 }] });
    expect(wizard.result).toBeNull();
    expect(wizard.error).toMatch(/^Buffer additions, line 1 \(phosphate-buffered saline, 1×\): /);
    const library = predictLibraryRecipe({ sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [{ kind: "PBS1x", perLitre: -0.2 }] });
    expect(library.result).toBeNull();
    expect(library.error).toMatch(/^Buffer additions, line 1 \(phosphate-buffered saline, 1×\): /);
    expect(JSON.stringify([wizard, library])).not.toMatch(/Invalid request|additions\[/);
  });
});
