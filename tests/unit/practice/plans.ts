/** Small approved-style plans (no blockers) for the practice tests, through the real schema. */
import { bucketLinks, bucketNodes, link, makePlan, node, type PlanDocument } from '../../helpers/plan-factory';

/** Bucket work: phases and neutral on a cluster bar, bucket bonded, worker reaches all phases. */
export const bucket = (): PlanDocument => makePlan({ nodes: bucketNodes(), links: bucketLinks() });

/** Bucket work plus a ground worker on a mat bonded to a truck jumpered to the neutral, and a pole ground on the bar. */
export function crew(): PlanDocument {
  return makePlan({
    nodes: [...bucketNodes(), node.truck('T1'), node.mat('M1'), node.worker('W2', 'M1'), node.poleGround('PG')],
    links: [...bucketLinks(), link.jumper('jT', 'T1', 'N'), link.jumper('jM', 'M1', 'T1'), link.reach('rT', 'W2', 'T1'), link.jumper('jPG', 'CB', 'PG')],
  });
}
