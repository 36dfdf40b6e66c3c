import type { RequestHandler } from "express";
import multer, { MulterError } from "multer";
import { PHOTO_LIMITS } from "../../shared/constants/evidence.ts";
import { AppError } from "../lib/errors.ts";

/**
 * Multipart photo uploads in memory (each file is decoded by sharp before anything is stored), limited in size and
 * count. The mimetype and name are not trusted; nothing is filtered here so every file gets its own verdict.
 */
const readPhotos = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: PHOTO_LIMITS.maxFileBytes, files: PHOTO_LIMITS.maxFilesPerUpload, fields: 5, parts: PHOTO_LIMITS.maxFilesPerUpload + 5 },
}).array("photos", PHOTO_LIMITS.maxFilesPerUpload);

/**
 * Limits come back as MulterError (mapped by the error handler); anything else multer passes on is the multipart
 * parser (busboy) failing to read the body (no boundary, a malformed part header, the form ending early), which is
 * the sender's fault: 400, never a 500.
 */
export const photoUpload: RequestHandler = (req, res, next) => {
  readPhotos(req, res, (err?: unknown) => {
    if (err && !(err instanceof MulterError) && !(err instanceof AppError)) {
      next(new AppError(400, "bad_upload", "The upload could not be read as a multipart form."));
      return;
    }
    next(err as Error | undefined);
  });
};
