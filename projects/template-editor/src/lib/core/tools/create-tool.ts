import { ArcSectionTool } from './arc-section.tool';
import { PanTool } from './pan.tool';
import { DeleteTool, FabricFillTool, StripSetTool } from './patch-click.tools';
import { RenumberTool } from './renumber.tool';
import { RingRepeatTool } from './ring-repeat.tool';
import { SelectTool } from './select.tool';
import { SplitTool } from './split.tool';
import { StraightSectionTool } from './straight-section.tool';
import type { BoardTool, ToolContext, ToolId } from './tool';
import { WedgeSectionTool } from './wedge-section.tool';

/** Makes the tool with the given id. */
export function createTool(id: ToolId, ctx: ToolContext): BoardTool {
  switch (id) {
    case 'select':
      return new SelectTool(ctx);
    case 'straight':
      return new StraightSectionTool(ctx);
    case 'arc':
      return new ArcSectionTool(ctx);
    case 'wedge':
      return new WedgeSectionTool(ctx);
    case 'split':
      return new SplitTool(ctx);
    case 'ring':
      return new RingRepeatTool(ctx);
    case 'fill':
      return new FabricFillTool(ctx);
    case 'strip-set':
      return new StripSetTool(ctx);
    case 'renumber':
      return new RenumberTool(ctx);
    case 'delete':
      return new DeleteTool(ctx);
    case 'pan':
      return new PanTool();
  }
}
