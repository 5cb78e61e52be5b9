import { z } from "zod";
import { MAX_TRANSFER_BYTES } from "@/lib/csv/transfer";

/** The transfer table as text (typed, pasted or read from a CSV file in the browser) and the file's name. */
export const transferBodySchema = z.object({
  text: z.string().max(MAX_TRANSFER_BYTES, { message: "At most 256 KiB of text" }),
  fileName: z.string().trim().min(1).max(200).optional(),
});
