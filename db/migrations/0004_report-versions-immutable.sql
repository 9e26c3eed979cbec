-- A signed report version is a record: no UPDATE and no DELETE, whoever asks.
CREATE OR REPLACE FUNCTION refuse_report_version_change() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'report versions are immutable: % refused', TG_OP
    USING ERRCODE = 'insufficient_privilege';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER report_versions_immutable
  BEFORE UPDATE OR DELETE ON report_versions
  FOR EACH ROW EXECUTE FUNCTION refuse_report_version_change();
--> statement-breakpoint
CREATE TRIGGER report_versions_no_truncate
  BEFORE TRUNCATE ON report_versions
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_report_version_change();
