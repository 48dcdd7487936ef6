/**
 * A request whose client goes away before the answer (closed tab, timeout, navigation) stops its
 * database work: statements it is running are cancelled and it gets no new connection
 * (server/db/request-scope.ts). Mounted after the body parser and the session, which read the
 * request stream: work started from stream events would not carry the request's scope.
 */
import type { RequestHandler } from "express";
import { runForRequest } from "../db/request-scope";

export const stopWorkWhenClientLeaves: RequestHandler = (_req, res, next) => {
  const controller = new AbortController();
  res.once("close", () => {
    if (!res.writableFinished) controller.abort();
  });
  runForRequest(controller.signal, next);
};
