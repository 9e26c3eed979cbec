import { Router } from 'express';
import { allow } from '../../http/access';
import { parse, parseId } from '../../http/validate';
import { assignmentInput, assignmentUpdate, subjectUpdate } from '../../contracts/assignments';
import { listFirmAssignments } from './assignments.repo';
import * as service from './assignments.service';

export const assignmentsRouter = Router();

assignmentsRouter.get('/assignments', allow('appraiser', 'reviewer', 'admin'), async (req, res) => {
  res.json({ assignments: await listFirmAssignments(req.auth!.user.organisationId) });
});

assignmentsRouter.post('/assignments', allow('appraiser'), async (req, res) => {
  res.status(201).json({ assignment: await service.createAssignment(req.auth!.user, parse(assignmentInput, req.body)) });
});

assignmentsRouter.get('/assignments/:id', allow('appraiser', 'reviewer', 'admin'), async (req, res) => {
  res.json(await service.getAssignmentDetail(req.auth!.user, parseId(req.params)));
});

assignmentsRouter.patch('/assignments/:id', allow('appraiser'), async (req, res) => {
  const id = parseId(req.params);
  res.json({ assignment: await service.updateAssignment(req.auth!.user, id, parse(assignmentUpdate, req.body)) });
});

assignmentsRouter.put('/assignments/:id/subject', allow('appraiser'), async (req, res) => {
  const id = parseId(req.params);
  res.json({ subject: await service.updateSubject(req.auth!.user, id, parse(subjectUpdate, req.body)) });
});
