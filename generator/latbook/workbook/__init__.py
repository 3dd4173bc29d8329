"""The workbook half: templates_src rendered into a live-formula .xlsx."""
