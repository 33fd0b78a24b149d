/* SPDX-License-Identifier: GPL-3.0-or-later */
#include "config.h"

#include "sw-narrow.h"
#include "sw-widget-text.h"

/* The shown choice: one line, ellipsized at the end. */
static void
shown_setup_cb (GtkSignalListItemFactory *factory, GtkListItem *item, gpointer data)
{
  GtkWidget *label = gtk_label_new (NULL);

  gtk_label_set_xalign (GTK_LABEL (label), 0.0f);
  gtk_label_set_ellipsize (GTK_LABEL (label), PANGO_ELLIPSIZE_END);
  gtk_label_set_width_chars (GTK_LABEL (label), 4);
  gtk_list_item_set_child (item, label);
}

/* A choice in the open list: in full. */
static void
list_setup_cb (GtkSignalListItemFactory *factory, GtkListItem *item, gpointer data)
{
  GtkWidget *label = gtk_label_new (NULL);

  gtk_label_set_xalign (GTK_LABEL (label), 0.0f);
  gtk_list_item_set_child (item, label);
}

static void
bind_cb (GtkSignalListItemFactory *factory, GtkListItem *item, gpointer data)
{
  GObject *o = gtk_list_item_get_item (item);
  GtkWidget *label = gtk_list_item_get_child (item);

  if (GTK_IS_STRING_OBJECT (o))
    {
      const char *text = gtk_string_object_get_string (GTK_STRING_OBJECT (o));
      gtk_label_set_text (GTK_LABEL (label), text);
      /* An ellipsized choice can still be read in full. */
      sw_widget_set_tooltip (label, gtk_label_get_ellipsize (GTK_LABEL (label))
                                            != PANGO_ELLIPSIZE_NONE ? text : NULL);
    }
}

static GtkListItemFactory *
factory_new (gboolean shown)
{
  GtkListItemFactory *f = gtk_signal_list_item_factory_new ();

  g_signal_connect (f, "setup", G_CALLBACK (shown ? shown_setup_cb : list_setup_cb), NULL);
  g_signal_connect (f, "bind", G_CALLBACK (bind_cb), NULL);
  return f;
}

static void
narrow_drop_down (GtkDropDown *dd)
{
  GListModel *model = gtk_drop_down_get_model (dd);
  g_autoptr (GtkListItemFactory) shown = NULL;
  g_autoptr (GtkListItemFactory) list = NULL;

  /* Only drop-downs of strings with the default factory. */
  if (!GTK_IS_STRING_LIST (model) || gtk_drop_down_get_expression (dd) != NULL)
    return;
  shown = factory_new (TRUE);
  list = factory_new (FALSE);
  gtk_drop_down_set_factory (dd, shown);
  gtk_drop_down_set_list_factory (dd, list);
}

/* The first label below @widget. */
static GtkLabel *
first_label (GtkWidget *widget)
{
  if (GTK_IS_LABEL (widget))
    return GTK_LABEL (widget);
  for (GtkWidget *c = gtk_widget_get_first_child (widget); c != NULL;
       c = gtk_widget_get_next_sibling (c))
    {
      GtkLabel *l = first_label (c);
      if (l != NULL)
        return l;
    }
  return NULL;
}

static void
wrap_label (GtkLabel *label)
{
  if (label == NULL || gtk_label_get_ellipsize (label) != PANGO_ELLIPSIZE_NONE)
    return;
  gtk_label_set_wrap (label, TRUE);
  gtk_label_set_wrap_mode (label, PANGO_WRAP_WORD);
}

void
sw_narrow_texts (GtkWidget *root)
{
  g_return_if_fail (GTK_IS_WIDGET (root));

  if (GTK_IS_DROP_DOWN (root))
    {
      narrow_drop_down (GTK_DROP_DOWN (root));
      return;
    }
  if (GTK_IS_CHECK_BUTTON (root) || GTK_IS_BUTTON (root) || GTK_IS_MENU_BUTTON (root))
    {
      GtkLabel *label = first_label (root);

      wrap_label (label);
      if (label != NULL && GTK_IS_BUTTON (root) && !GTK_IS_CHECK_BUTTON (root))
        gtk_label_set_justify (label, GTK_JUSTIFY_CENTER);
      return;
    }
  for (GtkWidget *c = gtk_widget_get_first_child (root); c != NULL;
       c = gtk_widget_get_next_sibling (c))
    sw_narrow_texts (c);
}
