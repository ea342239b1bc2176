CREATE TABLE "stored_file_chunks" (
	"file_id" text NOT NULL,
	"seq" integer NOT NULL,
	"data" "bytea" NOT NULL,
	CONSTRAINT "stored_file_chunks_file_id_seq_pk" PRIMARY KEY("file_id","seq")
);
--> statement-breakpoint
CREATE TABLE "stored_files" (
	"key" text PRIMARY KEY NOT NULL,
	"file_id" text NOT NULL,
	"size" bigint NOT NULL,
	"sha256" text NOT NULL,
	"chunk_bytes" integer NOT NULL,
	"modified_at" timestamp (3) with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "stored_files_file_id_unique" UNIQUE("file_id")
);
