import type { DataSource } from 'typeorm';
import type { CommentView, CreateCommentInput } from '../../shared/api/review.schema.js';
import { ProjectComment } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { recordActivity } from './activity.service.js';
import { loadProjectFor } from './project-guard.js';

const toView = (c: ProjectComment): CommentView => ({
  id: c.id,
  authorId: c.authorId,
  authorName: c.authorName,
  authorRole: c.authorRole,
  body: c.body,
  createdAt: c.createdAt.toISOString(),
});

/** The project's thread, oldest first. Staff and the project's reviewers read it alike. */
export async function listComments(ds: DataSource, actor: Actor, projectId: number): Promise<CommentView[]> {
  await loadProjectFor(ds, actor, projectId, 'read');
  const rows = await ds.getRepository(ProjectComment).find({
    where: { studioId: actor.studioId, projectId },
    order: { createdAt: 'ASC', id: 'ASC' },
    take: 1000,
  });
  return rows.map(toView);
}

/** Anyone who can read the project may write in its thread, reviewers included. */
export async function addComment(ds: DataSource, actor: Actor, projectId: number, input: CreateCommentInput): Promise<CommentView> {
  return ds.transaction(async (m) => {
    const project = await loadProjectFor(m, actor, projectId, 'read');
    const repo = m.getRepository(ProjectComment);
    const saved = await repo.save(
      repo.create({ projectId: project.id, studioId: actor.studioId, authorId: actor.userId, authorName: actor.name, authorRole: actor.role, body: input.body }),
    );
    const preview = input.body.length > 80 ? `${input.body.slice(0, 77)}…` : input.body;
    await recordActivity(m, {
      projectId: project.id,
      studioId: actor.studioId,
      actor,
      kind: 'comment.added',
      summary: `Commented: “${preview.replace(/\s+/g, ' ')}”`,
      details: { commentId: saved.id },
    });
    return toView(await repo.findOneByOrFail({ id: saved.id }));
  });
}
