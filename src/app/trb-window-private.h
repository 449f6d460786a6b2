/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include "trb-diagram-view.h"
#include "trb-member-list.h"
#include "trb-member-panel.h"
#include "trb-plan-canvas.h"
#include "trb-shortlist-panel.h"
#include "trb-window.h"

G_BEGIN_DECLS

/* Shared by trb-window.c and trb-window-actions.c. */
struct _TrbWindow
{
  AdwApplicationWindow  parent_instance;

  TrbDocument          *document;
  GSettings            *settings;
  gboolean              show_failing;
  gboolean              show_panel;
  gboolean              closing;        /* the user chose to close: no more questions */
  char                 *error;          /* the banner's message, or NULL */

  /* template children */
  AdwToastOverlay      *toast_overlay;
  AdwWindowTitle       *window_title;
  AdwSplitButton       *open_button;
  GtkSpinner           *solving_spinner;
  GtkDropDown          *floor_dropdown;   /* shown when the project has several floors */
  GtkStringList        *floor_names;
  GtkRevealer          *banner;
  GtkLabel             *banner_label;
  GtkPaned             *main_paned;
  GtkWidget            *side_panel;
  AdwViewStack         *side_stack;
  TrbPlanCanvas        *canvas;
  TrbMemberList        *member_list;
  TrbMemberPanel       *member_panel;
  TrbDiagramView       *diagram_view;
  TrbShortlistPanel    *shortlist;
  GtkRevealer          *tool_options;
  GtkWidget            *case_box;
  GtkDropDown          *case_dropdown;
  GtkWidget            *value_box;
  GtkLabel             *value_label;
  GtkEntry             *value_entry;
  GtkWidget            *spacing_box;
  GtkEntry             *spacing_entry;
  GtkLabel             *tool_note;
  GtkLabel             *hint_label;
  GtkLabel             *position_label;
  GMenu                *recent_menu;

  /* the text of the tool options' value entry, per tool */
  char                 *area_text;
  char                 *line_text;
  char                 *point_text;
};

void  trb_window_class_add_actions  (GtkWidgetClass *widget_class);
void  trb_window_update_actions     (TrbWindow      *self);
void  trb_window_show_floor         (TrbWindow      *self,
                                     int             step);
void  trb_window_save               (TrbWindow      *self,
                                     gboolean        save_as,
                                     gboolean        close_after);

G_END_DECLS
