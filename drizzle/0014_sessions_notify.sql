-- Sessions are remembered per app process for a few seconds too (src/lib/auth/auth-memory.ts), with the workspace
-- list of the switcher and the workspace's name: every change that ends or moves a session, and a workspace's new
-- name, notifies the processes as the changes of 0011 do. A new session (INSERT) notifies nothing: no process can
-- remember a session before it exists.
CREATE TRIGGER "sessions_auth_change" AFTER UPDATE OF "user_id", "workspace_id", "expires_at", "created_at" OR DELETE ON "sessions" FOR EACH STATEMENT EXECUTE FUNCTION "notify_auth_change"();
--> statement-breakpoint
DROP TRIGGER "workspaces_auth_change" ON "workspaces";
--> statement-breakpoint
CREATE TRIGGER "workspaces_auth_change" AFTER UPDATE OF "name" OR DELETE ON "workspaces" FOR EACH STATEMENT EXECUTE FUNCTION "notify_auth_change"();
