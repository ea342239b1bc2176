-- Stored files are mostly PDFs and images, already compressed: keep their chunks out of line but
-- uncompressed (PostgreSQL documentation, "TOAST": STORAGE EXTERNAL), so writing and reading them
-- spends no CPU on compression that gains nothing.
ALTER TABLE "stored_file_chunks" ALTER COLUMN "data" SET STORAGE EXTERNAL;
