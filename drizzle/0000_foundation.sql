CREATE TYPE "public"."genset_duty" AS ENUM('service', 'emergency');--> statement-breakpoint
CREATE TYPE "public"."role" AS ENUM('admin', 'superintendent', 'chief_engineer', 'energy_officer', 'planner');--> statement-breakpoint
CREATE TYPE "public"."speed_class" AS ENUM('high', 'medium', 'low');--> statement-breakpoint
CREATE TABLE "audit_log" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"company_id" uuid,
	"user_id" uuid,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"entity" text NOT NULL,
	"entity_id" text NOT NULL,
	"action" text NOT NULL,
	"before" jsonb,
	"after" jsonb
);
--> statement-breakpoint
CREATE TABLE "bus_sections" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vessel_id" uuid NOT NULL,
	"name" text NOT NULL,
	"sort_order" integer DEFAULT 0 NOT NULL
);
--> statement-breakpoint
CREATE TABLE "column_mappings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vessel_id" uuid NOT NULL,
	"name" text NOT NULL,
	"mapping" jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "companies" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"currency" text DEFAULT 'USD' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "curve_fits" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"genset_id" uuid NOT NULL,
	"window_kind" text NOT NULL,
	"from_date" date,
	"to_date" date,
	"input_hash" text NOT NULL,
	"inputs" jsonb NOT NULL,
	"result" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "deliveries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"subscription_id" uuid NOT NULL,
	"delivery_key" text NOT NULL,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "fuel_lots" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vessel_id" uuid NOT NULL,
	"reference" text NOT NULL,
	"grade" text NOT NULL,
	"density15_kg_per_m3" double precision NOT NULL,
	"lcv_mj_per_kg" double precision NOT NULL,
	"lcv_estimated" boolean DEFAULT false NOT NULL,
	"sulphur_pct" double precision,
	"quantity_t" double precision,
	"delivered_on" date NOT NULL,
	"attachment_path" text,
	"attachment_name" text,
	"attachment_type" text,
	"attachment_bytes" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "fuel_prices" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"grade" text NOT NULL,
	"price_per_t" double precision NOT NULL,
	"valid_from" date NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "genset_daily_logs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"genset_id" uuid NOT NULL,
	"log_date" date NOT NULL,
	"running_hours_meter" double precision,
	"hours_run" double precision,
	"kwh_meter" double precision,
	"kwh" double precision,
	"fuel_mass_kg" double precision,
	"fuel_volume_l" double precision,
	"fuel_temp_c" double precision,
	"fuel_lot_id" uuid,
	"remarks" text,
	"excluded_from_fit" boolean DEFAULT false NOT NULL,
	"exclude_reason" text,
	"source" text DEFAULT 'manual' NOT NULL,
	"import_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "genset_maintenance" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"genset_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"interval_hours" double precision NOT NULL,
	"interval_months" integer,
	"last_done_running_hours" double precision,
	"last_done_on" date
);
--> statement-breakpoint
CREATE TABLE "gensets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vessel_id" uuid NOT NULL,
	"bus_section_id" uuid,
	"designation" text NOT NULL,
	"rated_kw" double precision NOT NULL,
	"rated_kva" double precision NOT NULL,
	"voltage_v" double precision NOT NULL,
	"frequency_hz" double precision NOT NULL,
	"speed_class" "speed_class" NOT NULL,
	"min_load_pct" double precision NOT NULL,
	"max_load_pct" double precision NOT NULL,
	"start_cost_kg" double precision DEFAULT 0 NOT NULL,
	"min_up_h" double precision DEFAULT 0 NOT NULL,
	"min_down_h" double precision DEFAULT 0 NOT NULL,
	"shop_test_sfoc" jsonb NOT NULL,
	"duty" "genset_duty" DEFAULT 'service' NOT NULL,
	"available" boolean DEFAULT true NOT NULL,
	"unavailable_reason" text,
	"must_run" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "guidelines" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vessel_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"input_hash" text NOT NULL,
	"inputs" jsonb NOT NULL,
	"result" jsonb NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "hour_budget_plans" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vessel_id" uuid NOT NULL,
	"until_date" date NOT NULL,
	"inputs" jsonb NOT NULL,
	"result" jsonb NOT NULL,
	"status" text DEFAULT 'proposed' NOT NULL,
	"created_by" uuid,
	"approved_by" uuid,
	"approved_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "invitations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"email" text NOT NULL,
	"role" "role" NOT NULL,
	"vessel_ids" uuid[] DEFAULT '{}'::uuid[] NOT NULL,
	"token_hash" text NOT NULL,
	"invited_by" uuid,
	"expires_at" timestamp with time zone NOT NULL,
	"accepted_at" timestamp with time zone,
	"revoked_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "invitations_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
CREATE TABLE "log_import_changes" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"import_id" uuid NOT NULL,
	"genset_id" uuid NOT NULL,
	"log_date" date NOT NULL,
	"before" jsonb
);
--> statement-breakpoint
CREATE TABLE "log_imports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vessel_id" uuid NOT NULL,
	"user_id" uuid,
	"file_name" text NOT NULL,
	"file_sha256" text NOT NULL,
	"rows_new" integer DEFAULT 0 NOT NULL,
	"rows_changed" integer DEFAULT 0 NOT NULL,
	"rows_unchanged" integer DEFAULT 0 NOT NULL,
	"rows_rejected" integer DEFAULT 0 NOT NULL,
	"status" text DEFAULT 'committed' NOT NULL,
	"undone_at" timestamp with time zone,
	"undone_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "mail_outbox" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid,
	"to_address" text NOT NULL,
	"subject" text NOT NULL,
	"body_text" text NOT NULL,
	"status" text NOT NULL,
	"error" text,
	"smtp_message_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "maintenance_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"genset_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"done_on" date NOT NULL,
	"running_hours" double precision NOT NULL,
	"remarks" text,
	"recorded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "membership_vessels" (
	"membership_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	CONSTRAINT "membership_vessels_membership_id_vessel_id_pk" PRIMARY KEY("membership_id","vessel_id")
);
--> statement-breakpoint
CREATE TABLE "memberships" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"company_id" uuid NOT NULL,
	"role" "role" NOT NULL,
	"vessel_scoped" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "meter_replacements" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"genset_id" uuid NOT NULL,
	"meter" text NOT NULL,
	"replaced_on" date NOT NULL,
	"old_final_reading" double precision NOT NULL,
	"new_start_reading" double precision NOT NULL,
	"remarks" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "operating_rules" (
	"vessel_id" uuid NOT NULL,
	"mode" text NOT NULL,
	"margin_kw" double precision DEFAULT 0 NOT NULL,
	"margin_pct" double precision DEFAULT 0 NOT NULL,
	"min_sets" integer DEFAULT 1 NOT NULL,
	"n_minus_1" boolean DEFAULT false NOT NULL,
	"bus_tie_closed" boolean DEFAULT true NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "operating_rules_vessel_id_mode_pk" PRIMARY KEY("vessel_id","mode")
);
--> statement-breakpoint
CREATE TABLE "password_resets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"token_hash" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"used_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "password_resets_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
CREATE TABLE "sessions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"company_id" uuid NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"revoked_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sign_in_attempts" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"key" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "subscriptions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"vessel_id" uuid,
	"hours_before" double precision,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"password_hash" text,
	"disabled_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "vessel_mode_hours" (
	"vessel_id" uuid NOT NULL,
	"log_date" date NOT NULL,
	"sea_h" double precision DEFAULT 0 NOT NULL,
	"manoeuvring_h" double precision DEFAULT 0 NOT NULL,
	"port_h" double precision DEFAULT 0 NOT NULL,
	"anchorage_h" double precision DEFAULT 0 NOT NULL,
	"shore_power_h" double precision DEFAULT 0 NOT NULL,
	CONSTRAINT "vessel_mode_hours_vessel_id_log_date_pk" PRIMARY KEY("vessel_id","log_date")
);
--> statement-breakpoint
CREATE TABLE "vessels" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"name" text NOT NULL,
	"imo_number" text NOT NULL,
	"vessel_type" text NOT NULL,
	"fuel_grades" text[] DEFAULT '{}'::text[] NOT NULL,
	"pms_start_above_pct" double precision DEFAULT 85 NOT NULL,
	"pms_stop_below_pct" double precision DEFAULT 40 NOT NULL,
	"follows_recommendations_from" date,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "voyage_plans" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vessel_id" uuid NOT NULL,
	"name" text NOT NULL,
	"status" text DEFAULT 'queued' NOT NULL,
	"progress" double precision DEFAULT 0 NOT NULL,
	"inputs" jsonb NOT NULL,
	"result" jsonb,
	"error" text,
	"created_by" uuid,
	"approved_by" uuid,
	"approved_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "work_windows" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vessel_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"place" text NOT NULL,
	"starts_on" date NOT NULL,
	"ends_on" date NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "audit_log" ADD CONSTRAINT "audit_log_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_log" ADD CONSTRAINT "audit_log_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bus_sections" ADD CONSTRAINT "bus_sections_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "column_mappings" ADD CONSTRAINT "column_mappings_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "curve_fits" ADD CONSTRAINT "curve_fits_genset_id_gensets_id_fk" FOREIGN KEY ("genset_id") REFERENCES "public"."gensets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliveries" ADD CONSTRAINT "deliveries_subscription_id_subscriptions_id_fk" FOREIGN KEY ("subscription_id") REFERENCES "public"."subscriptions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fuel_lots" ADD CONSTRAINT "fuel_lots_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fuel_prices" ADD CONSTRAINT "fuel_prices_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "genset_daily_logs" ADD CONSTRAINT "genset_daily_logs_genset_id_gensets_id_fk" FOREIGN KEY ("genset_id") REFERENCES "public"."gensets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "genset_daily_logs" ADD CONSTRAINT "genset_daily_logs_fuel_lot_id_fuel_lots_id_fk" FOREIGN KEY ("fuel_lot_id") REFERENCES "public"."fuel_lots"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "genset_maintenance" ADD CONSTRAINT "genset_maintenance_genset_id_gensets_id_fk" FOREIGN KEY ("genset_id") REFERENCES "public"."gensets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "gensets" ADD CONSTRAINT "gensets_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "gensets" ADD CONSTRAINT "gensets_bus_section_id_bus_sections_id_fk" FOREIGN KEY ("bus_section_id") REFERENCES "public"."bus_sections"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "guidelines" ADD CONSTRAINT "guidelines_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "guidelines" ADD CONSTRAINT "guidelines_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "hour_budget_plans" ADD CONSTRAINT "hour_budget_plans_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "hour_budget_plans" ADD CONSTRAINT "hour_budget_plans_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "hour_budget_plans" ADD CONSTRAINT "hour_budget_plans_approved_by_users_id_fk" FOREIGN KEY ("approved_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_invited_by_users_id_fk" FOREIGN KEY ("invited_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "log_import_changes" ADD CONSTRAINT "log_import_changes_import_id_log_imports_id_fk" FOREIGN KEY ("import_id") REFERENCES "public"."log_imports"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "log_import_changes" ADD CONSTRAINT "log_import_changes_genset_id_gensets_id_fk" FOREIGN KEY ("genset_id") REFERENCES "public"."gensets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "log_imports" ADD CONSTRAINT "log_imports_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "log_imports" ADD CONSTRAINT "log_imports_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "log_imports" ADD CONSTRAINT "log_imports_undone_by_users_id_fk" FOREIGN KEY ("undone_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mail_outbox" ADD CONSTRAINT "mail_outbox_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "maintenance_events" ADD CONSTRAINT "maintenance_events_genset_id_gensets_id_fk" FOREIGN KEY ("genset_id") REFERENCES "public"."gensets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "maintenance_events" ADD CONSTRAINT "maintenance_events_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "membership_vessels" ADD CONSTRAINT "membership_vessels_membership_id_memberships_id_fk" FOREIGN KEY ("membership_id") REFERENCES "public"."memberships"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "membership_vessels" ADD CONSTRAINT "membership_vessels_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "meter_replacements" ADD CONSTRAINT "meter_replacements_genset_id_gensets_id_fk" FOREIGN KEY ("genset_id") REFERENCES "public"."gensets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "operating_rules" ADD CONSTRAINT "operating_rules_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "password_resets" ADD CONSTRAINT "password_resets_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sessions" ADD CONSTRAINT "sessions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sessions" ADD CONSTRAINT "sessions_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD CONSTRAINT "subscriptions_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD CONSTRAINT "subscriptions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD CONSTRAINT "subscriptions_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vessel_mode_hours" ADD CONSTRAINT "vessel_mode_hours_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vessels" ADD CONSTRAINT "vessels_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "voyage_plans" ADD CONSTRAINT "voyage_plans_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "voyage_plans" ADD CONSTRAINT "voyage_plans_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "voyage_plans" ADD CONSTRAINT "voyage_plans_approved_by_users_id_fk" FOREIGN KEY ("approved_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_windows" ADD CONSTRAINT "work_windows_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "audit_log_company_at_idx" ON "audit_log" USING btree ("company_id","at");--> statement-breakpoint
CREATE UNIQUE INDEX "bus_sections_vessel_name_idx" ON "bus_sections" USING btree ("vessel_id","name");--> statement-breakpoint
CREATE UNIQUE INDEX "column_mappings_vessel_name_idx" ON "column_mappings" USING btree ("vessel_id","name");--> statement-breakpoint
CREATE INDEX "curve_fits_genset_idx" ON "curve_fits" USING btree ("genset_id","window_kind","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "deliveries_once_idx" ON "deliveries" USING btree ("subscription_id","delivery_key");--> statement-breakpoint
CREATE UNIQUE INDEX "fuel_prices_grade_from_idx" ON "fuel_prices" USING btree ("company_id","grade","valid_from");--> statement-breakpoint
CREATE UNIQUE INDEX "genset_daily_logs_day_idx" ON "genset_daily_logs" USING btree ("genset_id","log_date");--> statement-breakpoint
CREATE INDEX "genset_daily_logs_import_idx" ON "genset_daily_logs" USING btree ("import_id");--> statement-breakpoint
CREATE UNIQUE INDEX "genset_maintenance_kind_idx" ON "genset_maintenance" USING btree ("genset_id","kind");--> statement-breakpoint
CREATE UNIQUE INDEX "gensets_vessel_designation_idx" ON "gensets" USING btree ("vessel_id","designation");--> statement-breakpoint
CREATE UNIQUE INDEX "guidelines_vessel_version_idx" ON "guidelines" USING btree ("vessel_id","version");--> statement-breakpoint
CREATE INDEX "hour_budget_plans_vessel_idx" ON "hour_budget_plans" USING btree ("vessel_id","created_at");--> statement-breakpoint
CREATE INDEX "log_import_changes_import_idx" ON "log_import_changes" USING btree ("import_id");--> statement-breakpoint
CREATE INDEX "mail_outbox_company_idx" ON "mail_outbox" USING btree ("company_id","created_at");--> statement-breakpoint
CREATE INDEX "maintenance_events_genset_idx" ON "maintenance_events" USING btree ("genset_id","done_on");--> statement-breakpoint
CREATE UNIQUE INDEX "memberships_user_company_idx" ON "memberships" USING btree ("user_id","company_id");--> statement-breakpoint
CREATE UNIQUE INDEX "meter_replacements_day_idx" ON "meter_replacements" USING btree ("genset_id","meter","replaced_on");--> statement-breakpoint
CREATE INDEX "sign_in_attempts_key_at_idx" ON "sign_in_attempts" USING btree ("key","at");--> statement-breakpoint
CREATE INDEX "subscriptions_company_idx" ON "subscriptions" USING btree ("company_id","kind");--> statement-breakpoint
CREATE UNIQUE INDEX "users_email_lower_idx" ON "users" USING btree (lower("email"));--> statement-breakpoint
CREATE UNIQUE INDEX "vessels_company_imo_idx" ON "vessels" USING btree ("company_id","imo_number");--> statement-breakpoint
CREATE INDEX "vessels_company_idx" ON "vessels" USING btree ("company_id");--> statement-breakpoint
CREATE INDEX "voyage_plans_vessel_idx" ON "voyage_plans" USING btree ("vessel_id","created_at");--> statement-breakpoint
CREATE INDEX "work_windows_vessel_idx" ON "work_windows" USING btree ("vessel_id","starts_on");