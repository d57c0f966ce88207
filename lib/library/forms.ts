import type { z } from "zod";
import { bufferFormSchema, bufferFormToContent } from "./buffers/content";
import { deviceFormSchema, deviceFormToContent } from "./devices/content";
import type { LibraryKind } from "./kinds";
import { populationFormSchema, populationFormToContent } from "./populations/content";

/** Each kind's lab-unit form schema and its conversion to SI content (used by the server action). */
export const FORMS = {
  populations: { schema: populationFormSchema, toContent: (f: unknown) => populationFormToContent(f as z.output<typeof populationFormSchema>) },
  buffers: { schema: bufferFormSchema, toContent: (f: unknown) => bufferFormToContent(f as z.output<typeof bufferFormSchema>) },
  devices: { schema: deviceFormSchema, toContent: (f: unknown) => deviceFormToContent(f as z.output<typeof deviceFormSchema>) },
} as const satisfies Record<LibraryKind, { schema: z.ZodType; toContent: (f: unknown) => unknown }>;
