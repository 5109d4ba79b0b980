-- The decider's name and e-mail and the project's name kept on a sign-off at its decision (migration 0012) are copies
-- for the hardware sheet: the history entry of the decision names the person already, so they are left out of it
-- like the decider's id and time (docs/decisions/0020-history.md).
DROP TRIGGER sign_offs_history ON sign_offs;
--> statement-breakpoint
CREATE TRIGGER sign_offs_history AFTER INSERT OR UPDATE OR DELETE ON sign_offs
  FOR EACH ROW EXECUTE FUNCTION record_history('sign-off', 'project_id',
    'submitted_by,submitted_at,decided_by,decided_at,decided_by_name,decided_by_email,decided_project_name', 'snapshot', 'status');
