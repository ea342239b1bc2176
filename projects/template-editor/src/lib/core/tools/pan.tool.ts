import type { BoardTool, ToolPreview } from './tool';

/** Pan: drag the board around. The board moves the view itself; the tool only names the mode. */
export class PanTool implements BoardTool {
  readonly id = 'pan' as const;
  readonly state = 'idle';
  readonly hint = 'Drag to move the view; the wheel zooms at the cursor';
  pointerDown(): void {}
  pointerMove(): void {}
  pointerUp(): void {}
  key(): boolean {
    return false;
  }
  cancel(): void {}
  preview(): ToolPreview | null {
    return null;
  }
}
