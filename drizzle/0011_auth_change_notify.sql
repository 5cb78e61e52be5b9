-- Every change that can end or narrow an API token's access notifies the app processes, which then forget the
-- tokens and memberships they remember (src/lib/auth/auth-cache.ts). NOTIFY is sent at commit, once per
-- transaction for the same payload. Writes of last_used_at alone notify nothing.
CREATE FUNCTION "notify_auth_change"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
	PERFORM pg_notify('pulsefence_auth', '');
	RETURN NULL;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER "api_tokens_auth_change" AFTER UPDATE OF "revoked_at", "expires_at", "user_id", "workspace_id", "token_hash" OR DELETE ON "api_tokens" FOR EACH STATEMENT EXECUTE FUNCTION "notify_auth_change"();
--> statement-breakpoint
CREATE TRIGGER "memberships_auth_change" AFTER INSERT OR UPDATE OR DELETE ON "memberships" FOR EACH STATEMENT EXECUTE FUNCTION "notify_auth_change"();
--> statement-breakpoint
CREATE TRIGGER "users_auth_change" AFTER UPDATE OF "email", "name", "password_hash" OR DELETE ON "users" FOR EACH STATEMENT EXECUTE FUNCTION "notify_auth_change"();
--> statement-breakpoint
CREATE TRIGGER "workspaces_auth_change" AFTER DELETE ON "workspaces" FOR EACH STATEMENT EXECUTE FUNCTION "notify_auth_change"();
