-- A release is fixed forever, whoever connects: its document, version, checksums, changelog and origin cannot be
-- updated, and no release can be deleted or truncated. Only deprecation and withdrawal may be recorded, once each.
CREATE OR REPLACE FUNCTION bandgate_guard_release() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP <> 'UPDATE' THEN
    RAISE EXCEPTION 'bandgate: % on releases is not allowed (releases are immutable)', TG_OP USING ERRCODE = 'insufficient_privilege';
  END IF;
  IF NEW.id IS DISTINCT FROM OLD.id OR NEW.family_id IS DISTINCT FROM OLD.family_id OR NEW.version IS DISTINCT FROM OLD.version
     OR NEW.document IS DISTINCT FROM OLD.document OR NEW.sha256 IS DISTINCT FROM OLD.sha256
     OR NEW.physics_hash IS DISTINCT FROM OLD.physics_hash OR NEW.changelog IS DISTINCT FROM OLD.changelog
     OR NEW.proposal_id IS DISTINCT FROM OLD.proposal_id OR NEW.released_by IS DISTINCT FROM OLD.released_by
     OR NEW.created_at IS DISTINCT FROM OLD.created_at THEN
    RAISE EXCEPTION 'bandgate: release % % is immutable; only deprecation and withdrawal may be recorded', OLD.id, OLD.version
      USING ERRCODE = 'insufficient_privilege';
  END IF;
  IF (OLD.deprecated_at IS NOT NULL AND (NEW.deprecated_at IS DISTINCT FROM OLD.deprecated_at
        OR NEW.deprecation_reason IS DISTINCT FROM OLD.deprecation_reason OR NEW.successor_id IS DISTINCT FROM OLD.successor_id))
     OR (OLD.withdrawn_at IS NOT NULL AND (NEW.withdrawn_at IS DISTINCT FROM OLD.withdrawn_at
        OR NEW.withdrawal_reason IS DISTINCT FROM OLD.withdrawal_reason)) THEN
    RAISE EXCEPTION 'bandgate: a deprecation or withdrawal of release % is recorded once and never changed', OLD.version
      USING ERRCODE = 'insufficient_privilege';
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER releases_immutable BEFORE UPDATE OR DELETE ON releases
  FOR EACH ROW EXECUTE FUNCTION bandgate_guard_release();
--> statement-breakpoint
CREATE TRIGGER releases_no_truncate BEFORE TRUNCATE ON releases
  FOR EACH STATEMENT EXECUTE FUNCTION bandgate_guard_release();
