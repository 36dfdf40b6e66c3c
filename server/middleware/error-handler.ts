import type { ErrorRequestHandler, RequestHandler } from "express";
import { MulterError } from "multer";
import { z } from "zod";
import { AppError } from "../lib/errors.ts";
import { zodFields } from "./validate.ts";

interface WireError {
  status: number;
  body: { error: { code: string; message: string; fields?: Record<string, string> } & Record<string, unknown> };
}

const wire = (status: number, code: string, message: string, extra: Record<string, unknown> = {}): WireError => ({
  status,
  body: { error: { code, message, ...extra } },
});

const multerMessages: Record<string, [number, string]> = {
  LIMIT_FILE_SIZE: [413, "A file is larger than the limit."],
  LIMIT_FILE_COUNT: [413, "Too many files in one upload."],
  LIMIT_PART_COUNT: [413, "The upload has too many parts."],
  LIMIT_FIELD_VALUE: [413, "A form field is too long."],
  LIMIT_UNEXPECTED_FILE: [400, "Files must be sent in the field named “photos”."],
};

function toWire(err: unknown): WireError | null {
  if (err instanceof AppError) {
    return wire(err.status, err.code, err.message, {
      ...(err.fields ? { fields: err.fields } : {}),
      ...(err.details ?? {}),
    });
  }
  if (err instanceof z.ZodError) {
    return wire(400, "validation_failed", "Some fields need attention.", { fields: zodFields(err) });
  }
  if (err instanceof MulterError) {
    const [status, message] = multerMessages[err.code] ?? [400, "The upload could not be read."];
    return wire(status, status === 413 ? "too_large" : "bad_upload", message);
  }
  const e = err as { type?: string; status?: number; code?: string; errno?: number };
  // body-parser errors: malformed JSON, too large, wrong charset.
  if (e?.type === "entity.parse.failed") return wire(400, "malformed_body", "The request body is not valid JSON.");
  if (e?.type === "entity.too.large") return wire(413, "too_large", "The request body is too large.");
  if (e?.type === "charset.unsupported" || e?.type === "encoding.unsupported")
    return wire(415, "unsupported_encoding", "The request body's encoding is not supported.");
  if (e?.code === "ER_DUP_ENTRY" || e?.errno === 1062)
    return wire(409, "duplicate", "A record with the same unique value already exists.");
  if (typeof e?.status === "number" && e.status >= 400 && e.status < 500)
    return wire(e.status, "bad_request", "The request could not be processed.");
  return null;
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const known = toWire(err);
  if (res.headersSent) {
    res.end();
    return;
  }
  if (known) {
    if (known.status === 429 && typeof known.body.error.retryAfterSeconds === "number") {
      res.setHeader("Retry-After", String(known.body.error.retryAfterSeconds));
    }
    res.status(known.status).json(known.body);
    return;
  }
  req.log?.error({ err }, "unhandled error");
  res.status(500).json({ error: { code: "internal", message: "Something went wrong on our side. Nothing was saved." } });
};

export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: "not_found", message: `No API route ${req.method} ${req.path}.` } });
};
