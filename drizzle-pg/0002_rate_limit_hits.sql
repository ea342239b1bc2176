CREATE TABLE "rate_limit_hits" (
	"key" text PRIMARY KEY NOT NULL,
	"hits" integer NOT NULL,
	"reset_at" bigint NOT NULL
);
--> statement-breakpoint
CREATE INDEX "rate_limit_hits_reset_idx" ON "rate_limit_hits" USING btree ("reset_at");