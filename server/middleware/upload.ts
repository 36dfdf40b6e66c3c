import multer from "multer";
import { PHOTO_LIMITS } from "../../shared/constants/evidence.ts";

/**
 * Multipart photo uploads in memory (each file is decoded by sharp before anything is stored), limited in size and
 * count. The mimetype and name are not trusted; nothing is filtered here so every file gets its own verdict.
 */
export const photoUpload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: PHOTO_LIMITS.maxFileBytes, files: PHOTO_LIMITS.maxFilesPerUpload, fields: 5, parts: PHOTO_LIMITS.maxFilesPerUpload + 5 },
}).array("photos", PHOTO_LIMITS.maxFilesPerUpload);
