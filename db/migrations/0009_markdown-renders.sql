CREATE TABLE "markdown_renders" (
	"source_sha256" text NOT NULL,
	"renderer" text NOT NULL,
	"html" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "markdown_renders_source_sha256_renderer_pk" PRIMARY KEY("source_sha256","renderer")
);
