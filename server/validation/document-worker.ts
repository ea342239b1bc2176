/** The validation pool's task (a piscina worker thread): checks one document body from its bytes. */
import { checkDocumentBody, type DocumentBodyResult, type DocumentBodyTask } from './document-body';

export default function documentTask(task: DocumentBodyTask): DocumentBodyResult {
  return checkDocumentBody(task);
}
